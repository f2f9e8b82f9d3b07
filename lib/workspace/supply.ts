import { stateIdsOf, type CircuitDocument } from "@/lib/circuit";
import { solveCircuit, type SolveResult } from "@/lib/solver";

/**
 * How deep a lead-acid starting battery may be run before it is recharged: half its rated capacity (common
 * practice (no source); deep discharges shorten its life, and a starting battery must still crank afterwards).
 */
export const USABLE_FRACTION = 0.5;

export type SupplyRow = {
  stateId: string;
  stateName: string;
  /** What the loads and the starter draw, A. */
  demandA: number;
  /** What the running alternators deliver, A, and what they are rated for. */
  alternatorA: number;
  ratedA: number;
  /** Net battery current, A: positive while the batteries charge, negative while they carry a deficit. */
  batteryA: number;
  capacityAh: number | null;
  /** Hours until the batteries reach the usable fraction of their capacity, when they are carrying a deficit. */
  hoursToHalf: number | null;
  verdict: "keeps-up" | "at-limit" | "deficit" | "battery-only" | "no-solution";
  message: string;
};

const fmt = (x: number, d = 1) => x.toFixed(d);

/** One state's supply balance from its solve. */
export function supplyRow(doc: CircuitDocument, stateId: string, r: SolveResult): SupplyRow {
  const name = stateId === "base" ? "Base" : ((doc.states ?? []).find((s) => s.id === stateId)?.name ?? stateId);
  const row: SupplyRow = { stateId, stateName: name, demandA: 0, alternatorA: 0, ratedA: 0, batteryA: 0, capacityAh: null, hoursToHalf: null, verdict: "no-solution", message: "" };
  if (r.status !== "ok") return { ...row, message: `${name}: the circuit does not solve in this state; fix the problems listed first.` };
  let capacity = 0;
  let batteries = 0;
  let anyCapacity = false;
  let limited = false;
  for (const c of doc.components) {
    const cr = r.components[c.id];
    if (!cr) continue;
    if ((c.kind === "load" || c.kind === "starter") && cr.mode !== "off") row.demandA += Math.max(0, cr.current ?? 0);
    if (c.kind === "alternator" && cr.mode && cr.mode !== "off" && cr.mode !== "blocked") {
      // The solver counts an alternator's current into its B+ terminal, so delivered current is negative.
      row.alternatorA += Math.max(0, -(cr.current ?? 0));
      const enabled = (doc.states ?? []).find((s) => s.id === stateId)?.set[c.id]?.ratedCurrent;
      row.ratedA += typeof enabled === "number" ? enabled : c.ratedCurrent;
      if (cr.mode === "current-limit") limited = true;
    }
    if (c.kind === "battery") {
      batteries++;
      row.batteryA += cr.current ?? 0;
      if (c.capacityAh) {
        capacity += c.capacityAh;
        anyCapacity = true;
      }
    }
  }
  row.capacityAh = anyCapacity ? capacity : null;
  const deficit = -row.batteryA;
  const them = batteries > 1 ? "the batteries" : "the battery";
  const They = batteries > 1 ? "The batteries" : "The battery";
  if (deficit > 0.05 && anyCapacity) row.hoursToHalf = (USABLE_FRACTION * capacity) / deficit;
  const runtime =
    row.hoursToHalf === null
      ? anyCapacity
        ? ""
        : ` Give ${them} ${batteries > 1 ? "their" : "its"} capacity (Ah) to see how long ${batteries > 1 ? "they last" : "it lasts"}.`
      : ` ${They} (${fmt(capacity, 0)} Ah) ${batteries > 1 ? "reach" : "reaches"} half charge in about ${Math.round(row.hoursToHalf * 60) >= 60 ? `${fmt(row.hoursToHalf)} h` : `${Math.max(1, Math.round(row.hoursToHalf * 60))} min`} at this rate.`;
  if (row.ratedA === 0) {
    row.verdict = deficit > 0.05 ? "battery-only" : "keeps-up";
    row.message = deficit > 0.05 ? `${name}: no alternator is charging, so ${them} ${batteries > 1 ? "carry" : "carries"} all ${fmt(deficit)} A.${runtime}` : `${name}: nothing is drawing from ${them}.`;
  } else if (deficit > 0.05) {
    row.verdict = "deficit";
    row.message = `${name}: the loads want ${fmt(row.demandA)} A; the charging system gives ${fmt(row.alternatorA)} A of its ${fmt(row.ratedA, 0)} A rating, so ${them} ${batteries > 1 ? "make" : "makes"} up ${fmt(deficit)} A and ${batteries > 1 ? "are" : "is"} running down.${runtime}`;
  } else if (limited || row.alternatorA > 0.9 * row.ratedA) {
    row.verdict = "at-limit";
    row.message = `${name}: the charging system keeps up, but at ${fmt(row.alternatorA)} A of its ${fmt(row.ratedA, 0)} A rating there is little to spare; an alternator at full output runs hot (common practice (no source)).`;
  } else {
    row.verdict = "keeps-up";
    row.message = `${name}: the charging system keeps up with ${fmt(row.ratedA - row.alternatorA)} A to spare (${fmt(row.alternatorA)} A of ${fmt(row.ratedA, 0)} A).`;
  }
  return row;
}

/** The supply balance in every state of a circuit: the total load against the alternators and the batteries. */
export function supplyCheck(doc: CircuitDocument): SupplyRow[] {
  return stateIdsOf(doc).map((id) => supplyRow(doc, id, solveCircuit(doc, { state: id })));
}
