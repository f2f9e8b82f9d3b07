import type { CircuitDocument } from "./schema";
import { TERMINALS } from "./schema";

/** Every terminal of a document, as "<component id>.<terminal>", in component order. */
export function terminalsOf(doc: CircuitDocument): string[] {
  return doc.components.flatMap((c) => TERMINALS[c.kind].map((t) => `${c.id}.${t}`));
}

/** The operating states a reading or a solve may name: "base" and the document's own. */
export function stateIdsOf(doc: CircuitDocument): string[] {
  return ["base", ...(doc.states ?? []).map((s) => s.id)];
}

/** Why a probe pair or state does not fit the document, as field paths and messages; empty when it fits. */
export function probeIssues(doc: CircuitDocument, r: { positive?: string; negative?: string; stateId?: string }, prefix = "") {
  const terminals = new Set(terminalsOf(doc));
  const states = stateIdsOf(doc);
  const issues: { path: string; message: string }[] = [];
  for (const key of ["positive", "negative"] as const) {
    const ref = r[key];
    if (ref !== undefined && !terminals.has(ref)) issues.push({ path: `${prefix}${key}`, message: `${ref} is not a terminal of this circuit` });
  }
  if (r.positive !== undefined && r.positive === r.negative) issues.push({ path: `${prefix}negative`, message: "the two probes are on the same terminal" });
  if (r.stateId !== undefined && !states.includes(r.stateId)) {
    issues.push({ path: `${prefix}stateId`, message: `${r.stateId} is not an operating state of this circuit (it has ${states.join(", ")})` });
  }
  return issues;
}

/** An empty document to start a circuit from. */
export function emptyCircuit(name: string, systemVoltage: number): CircuitDocument {
  return { schema: "ampwright.circuit/1", name, systemVoltage, components: [], wires: [] };
}
