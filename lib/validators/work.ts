import { z } from "zod";
import { typedNumber } from "@/lib/units/number";
import { idText, PG_INT_MAX, plainText } from "./text";
import { loadCircuit, type CircuitDocument } from "@/lib/circuit";

/** Largest body the work routes take (a circuit document of a few thousand components fits). */
export const MAX_WORK_BYTES = 4 * 1024 * 1024;
/** Largest circuit a job may hold, as for the solve endpoint. */
export const MAX_CIRCUIT_COMPONENTS = 5000;

import { JOB_STATUSES } from "./job-status";

export { JOB_STATUSES, type JobStatus } from "./job-status";
export const jobStatus = z.enum(JOB_STATUSES, { error: `status is one of ${JOB_STATUSES.join(", ")}` });

const text = plainText;

export const createJobInput = z.strictObject({
  /** The shop or class the job belongs to; defaults to the one the user is working in. */
  organizationId: idText("organizationId").optional(),
  title: text("title", 200).min(2, "give the job a title of at least 2 characters (e.g. \"Battery light at idle\")"),
  vehicle: text("vehicle", 500).default(""),
  systemVoltage: z
    .number({ error: "systemVoltage must be a number of volts, such as 12 or 24" })
    .finite()
    .min(6, "systemVoltage is at least 6 V")
    .max(1000, "systemVoltage is at most 1000 V")
    .default(12),
  complaint: text("complaint", 4000).default(""),
  status: jobStatus.default("open"),
});
export const updateJobInput = z
  .strictObject({
    title: createJobInput.shape.title,
    vehicle: text("vehicle", 500),
    systemVoltage: z.number({ error: "systemVoltage must be a number of volts" }).finite().min(6).max(1000),
    complaint: text("complaint", 4000),
    findings: text("findings", 4000),
    repair: text("repair", 4000),
    status: jobStatus,
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change", path: ["(body)"] });
export type CreateJobInput = z.input<typeof createJobInput>;
export type UpdateJobInput = z.input<typeof updateJobInput>;

export const JOB_SORTS = ["updated", "created", "title", "status"] as const;
export const listJobsQuery = z.strictObject({
  organizationId: idText("organizationId").optional(),
  q: plainText("q", 200).optional(),
  status: jobStatus.optional(),
  sort: z.enum(JOB_SORTS, { error: `sort is one of ${JOB_SORTS.join(", ")}` }).default("updated"),
  dir: z.enum(["asc", "desc"]).optional(),
  limit: z.coerce.number({ error: "limit must be a whole number" }).int().min(1).max(100).default(25),
  cursor: z.string().max(500).regex(/^[A-Za-z0-9_-]*$/, "cursor is not one this list gave out").optional(),
});
export type ListJobsQuery = z.infer<typeof listJobsQuery>;

/**
 * A circuit document field: any known document version, migrated to the current one and validated by
 * lib/circuit, with the issue paths kept under the field.
 */
export const circuitDocumentField = z.unknown().transform((value, ctx): CircuitDocument => {
  const comps = (value as { components?: unknown } | null)?.components;
  if (Array.isArray(comps) && comps.length > MAX_CIRCUIT_COMPONENTS) {
    ctx.addIssue({ code: "custom", message: `at most ${MAX_CIRCUIT_COMPONENTS} components in one circuit (this one has ${comps.length})`, path: ["components"] });
    return z.NEVER;
  }
  const loaded = loadCircuit(value);
  if (!loaded.ok) {
    for (const i of loaded.issues) ctx.addIssue({ code: "custom", message: i.message, path: i.path === "(document)" ? [] : i.path.split(".") });
    return z.NEVER;
  }
  return loaded.document;
});

export const createCircuitInput = z
  .strictObject({
    name: text("name", 200).min(1, "give the circuit a name").optional(),
    document: circuitDocumentField.optional(),
    message: text("message", 500).optional(),
  })
  .refine((v) => v.name !== undefined || v.document !== undefined, { message: "send a name (for an empty circuit) or a document", path: ["name"] });
export const replaceCircuitInput = z.strictObject({
  document: circuitDocumentField,
  message: text("message", 500).optional(),
});
export const restoreCircuitInput = z.strictObject({
  version: z.number({ error: "version must be a whole number" }).int().min(1, "versions start at 1").max(PG_INT_MAX, "no circuit has that many versions"),
  message: text("message", 500).optional(),
});

/** When a reading was taken: a date and time from 2000 up to a day ahead of the server's clock (time zones). */
const readingTime = z.iso
  .datetime({ offset: true, error: "takenAt is a date and time such as 2026-12-02T09:30:00Z" })
  .refine((v) => Date.parse(v) >= Date.UTC(2000, 0, 1), { message: "takenAt is before 2000; check the date" })
  .refine((v) => Date.parse(v) <= Date.now() + 86_400_000, { message: "takenAt is in the future; check the date" });

const terminal = z
  .string({ error: 'a probe point is a terminal written "<component id>.<terminal>", like "B1.pos"' })
  .regex(/^[A-Za-z0-9_-]+\.[a-z]+$/, 'a probe point is a terminal written "<component id>.<terminal>", like "B1.pos"');
export const createReadingInput = z.strictObject({
  stateId: plainText("stateId", 64).min(1).default("base"),
  /** Where the red (positive) lead touched. */
  positive: terminal,
  /** Where the black (negative) lead touched. */
  negative: terminal,
  value: typedNumber(z.number({ error: "value must be the number the meter showed" }).finite().min(-2000, "a reading is at most 2000 either way").max(2000, "a reading is at most 2000 either way")),
  unit: z.enum(["V", "mV"], { error: 'unit is "V" or "mV"' }).default("V"),
  currentA: typedNumber(z.number({ error: "the clamp reading must be a number of amperes" }).finite().min(-5000, "a clamp reading is at most 5000 A either way").max(5000, "a clamp reading is at most 5000 A either way").nullable().optional()),
  note: text("note", 2000).default(""),
  takenAt: readingTime.optional(),
});
export const updateReadingInput = z
  .strictObject({
    stateId: createReadingInput.shape.stateId.unwrap(),
    positive: terminal,
    negative: terminal,
    value: createReadingInput.shape.value,
    unit: z.enum(["V", "mV"], { error: 'unit is "V" or "mV"' }),
    currentA: createReadingInput.shape.currentA,
    note: text("note", 2000),
    takenAt: createReadingInput.shape.takenAt.unwrap(),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change", path: ["(body)"] });
export type CreateReadingInput = z.input<typeof createReadingInput>;

/** The export file: a circuit document with its readings. Import takes this or a bare document. */
export const EXPORT_FORMAT = "ampwright.circuit-export/1";
const exportedReading = createReadingInput.extend({ takenBy: z.string().max(200).nullable().optional(), id: z.string().max(100).optional() });
export const importInput = z.union([
  z.strictObject({
    format: z.literal(EXPORT_FORMAT),
    exportedAt: z.string().max(100).optional(),
    circuit: z.strictObject({ name: text("name", 200).optional(), version: z.number().int().min(1).max(PG_INT_MAX).optional(), document: circuitDocumentField }),
    readings: z.array(exportedReading).max(10_000).default([]),
  }),
  z.strictObject({ document: circuitDocumentField }),
]);
export type ImportInput = z.infer<typeof importInput>;
