import type { CircuitDocument } from "./schema";

export type IdDiff = { added: string[]; removed: string[]; changed: string[] };
export type DocumentDiff = {
  /** Header fields (name, systemVoltage, ambientC, conductorTemp) whose values differ. */
  fields: { field: string; from: unknown; to: unknown }[];
  components: IdDiff;
  wires: IdDiff;
  states: IdDiff;
  same: boolean;
};

/** JSON with object keys sorted, so key order never counts as a change. */
function canonical(v: unknown): string {
  return JSON.stringify(v, (_k, val: unknown) =>
    val && typeof val === "object" && !Array.isArray(val)
      ? Object.fromEntries(Object.entries(val as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b)))
      : val,
  );
}

function byId(from: { id: string }[], to: { id: string }[]): IdDiff {
  const a = new Map(from.map((x) => [x.id, canonical(x)]));
  const b = new Map(to.map((x) => [x.id, canonical(x)]));
  return {
    added: [...b.keys()].filter((id) => !a.has(id)),
    removed: [...a.keys()].filter((id) => !b.has(id)),
    changed: [...b.keys()].filter((id) => a.has(id) && a.get(id) !== b.get(id)),
  };
}

/** What changed from one circuit document to another, part by part (by id), for compare and history views. */
export function diffDocuments(from: CircuitDocument, to: CircuitDocument): DocumentDiff {
  const fields = (["name", "systemVoltage", "ambientC", "conductorTemp"] as const)
    .filter((f) => canonical(from[f]) !== canonical(to[f]))
    .map((f) => ({ field: f, from: from[f], to: to[f] }));
  const components = byId(from.components, to.components);
  const wires = byId(from.wires, to.wires);
  const states = byId(from.states ?? [], to.states ?? []);
  const none = (d: IdDiff) => !d.added.length && !d.removed.length && !d.changed.length;
  return { fields, components, wires, states, same: !fields.length && none(components) && none(wires) && none(states) };
}

const TOP_ORDER = ["schema", "name", "systemVoltage", "ambientC", "conductorTemp", "components", "wires", "states"];
const PART_ORDER = ["id", "kind", "label", "from", "to", "name"];

function ordered(value: unknown, order: string[]): unknown {
  if (Array.isArray(value)) return value.map((v) => ordered(v, PART_ORDER));
  if (!value || typeof value !== "object") return value;
  const rank = (k: string) => (order.includes(k) ? order.indexOf(k) : order.length);
  const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => rank(a) - rank(b) || a.localeCompare(b));
  return Object.fromEntries(entries.map(([k, v]) => [k, ordered(v, PART_ORDER)]));
}

/**
 * A document as indented JSON in one stable key order (the database does not keep the order it was given), so two
 * versions can be read side by side.
 */
export function formatDocument(doc: CircuitDocument): string {
  return JSON.stringify(ordered(doc, TOP_ORDER), null, 2);
}
