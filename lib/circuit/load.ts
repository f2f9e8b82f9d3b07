import { z } from "zod";
import { CIRCUIT_SCHEMA_V1, circuitSchemaV1, type CircuitDocument } from "./schema";

export type LoadIssue = { path: string; message: string };
export type LoadResult = { ok: true; document: CircuitDocument; migratedFrom?: string } | { ok: false; issues: LoadIssue[] };

/**
 * Migrations from older document versions to the current one, applied in turn. Version 1 is the first; a later
 * version adds `"ampwright.circuit/1": (doc) => <version 2 doc>` here and moves CURRENT.
 */
const MIGRATIONS: Record<string, (doc: Record<string, unknown>) => Record<string, unknown>> = {};
export const CURRENT_SCHEMA = CIRCUIT_SCHEMA_V1;

/** Reads a circuit document of any known version, migrating it to the current one, and validates it. */
export function loadCircuit(input: unknown): LoadResult {
  if (typeof input !== "object" || input === null || Array.isArray(input)) {
    return { ok: false, issues: [{ path: "(document)", message: "a circuit document is a JSON object" }] };
  }
  let doc = input as Record<string, unknown>;
  const from = typeof doc.schema === "string" ? doc.schema : undefined;
  let guard = 0;
  while (typeof doc.schema === "string" && doc.schema !== CURRENT_SCHEMA && MIGRATIONS[doc.schema] && guard++ < 20) {
    doc = MIGRATIONS[doc.schema](doc);
  }
  if (doc.schema !== CURRENT_SCHEMA) {
    return {
      ok: false,
      issues: [{ path: "schema", message: `unknown document version ${JSON.stringify(doc.schema)}; expected "${CURRENT_SCHEMA}"` }],
    };
  }
  const parsed = circuitSchemaV1.safeParse(doc);
  if (!parsed.success) return { ok: false, issues: issuesOf(parsed.error) };
  return { ok: true, document: parsed.data, ...(from !== CURRENT_SCHEMA ? { migratedFrom: from } : {}) };
}

export function issuesOf(error: z.ZodError): LoadIssue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join(".") || "(document)", message: i.message }));
}
