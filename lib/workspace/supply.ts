import { stateIdsOf, type CircuitDocument } from "@/lib/circuit";
import { solveCircuit, type SolveResult } from "@/lib/solver";

/**
 * How deep a lead-acid starting battery may be run before it is recharged: half its rated capacity (common
 * practice (no source); deep discharges shorten its life, and a starting battery must still crank afterwards).
 */
export const USABLE_FRACTION = 0.5;
/**
 * Peukert's law (W. Peukert, 1897): at a constant current I a battery rated C ampere-hours over H hours lasts
 * t = H (C / (I H))^k. k about 1.1 to 1.3 for flooded lead-acid (common practice, no source); 1.25 when not given.
 */
export const PEUKERT_DEFAULT = 1.25;
/** The hours a battery's Ah rating is given over (the 20-hour rate of lead-acid starting batteries; SAE J537, from memory). */
export const RATED_HOURS = 20;
/** An alternator's output at engine idle as a share of its rating (common practice, no source; makers publish curves). */
export const IDLE_FRACTION_DEFAULT = 0.6;

/** Hours until a battery of capacityAh reaches the usable fraction at a steady deficitA, by Peukert's law. */
export function hoursToUsable(capacityAh: number, deficitA: number, exponent = PEUKERT_DEFAULT, usable = USABLE_FRACTION): number {
  const full = RATED_HOURS * (capacityAh / (deficitA * RATED_HOURS)) ** exponent;
  return usable * full;
}

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
  /** Hours until the batteries reach the usable fraction of their capacity, when they are carrying a deficit (Peukert). */
  hoursToHalf: number | null;
  /** What the alternators give at engine idle, A, and whether that still covers the loads. */
  idleA: number;
  idleShortA: number | null;
  verdict: "keeps-up" | "at-limit" | "deficit" | "battery-only" | "no-solution";
  message: string;
};

const fmt = (x: number, d = 1) => x.toFixed(d);

/** One state's supply balance from its solve. */
export function supplyRow(doc: CircuitDocument, stateId: string, r: SolveResult): SupplyRow {
  const name = stateId === "base" ? "Base" : ((doc.states ?? []).find((s) => s.id === stateId)?.name ?? stateId);
  const row: SupplyRow = { stateId, stateName: name, demandA: 0, alternatorA: 0, ratedA: 0, batteryA: 0, capacityAh: null, hoursToHalf: null, idleA: 0, idleShortA: null, verdict: "no-solution", message: "" };
  if (r.status !== "ok") return { ...row, message: `${name}: the circuit does not solve in this state; fix the problems listed first.` };
  let capacity = 0;
  let batteries = 0;
  let anyCapacity = false;
  let exponentWeighted = 0;
  let limited = false;
  for (const c of doc.components) {
    const cr = r.components[c.id];
    if (!cr) continue;
    if ((c.kind === "load" || c.kind === "starter") && cr.mode !== "off") row.demandA += Math.max(0, cr.current ?? 0);
    if (c.kind === "alternator" && cr.mode && cr.mode !== "off" && cr.mode !== "blocked") {
      // The solver counts an alternator's current into its B+ terminal, so delivered current is negative.
      row.alternatorA += Math.max(0, -(cr.current ?? 0));
      const enabled = (doc.states ?? []).find((s) => s.id === stateId)?.set[c.id]?.ratedCurrent;
      const rated = typeof enabled === "number" ? enabled : c.ratedCurrent;
      row.ratedA += rated;
      row.idleA += rated * (c.idleFraction ?? IDLE_FRACTION_DEFAULT);
      if (cr.mode === "current-limit") limited = true;
    }
    if (c.kind === "battery") {
      batteries++;
      row.batteryA += cr.current ?? 0;
      if (c.capacityAh) {
        capacity += c.capacityAh;
        exponentWeighted += c.capacityAh * (c.peukertExponent ?? PEUKERT_DEFAULT);
        anyCapacity = true;
      }
    }
  }
  row.capacityAh = anyCapacity ? capacity : null;
  const deficit = -row.batteryA;
  const them = batteries > 1 ? "the batteries" : "the battery";
  const They = batteries > 1 ? "The batteries" : "The battery";
  if (deficit > 0.05 && anyCapacity) row.hoursToHalf = hoursToUsable(capacity, deficit, exponentWeighted / capacity);
  const idleNote = (demand: number) => {
    if (row.ratedA === 0) return "";
    if (demand > row.idleA + 0.05) {
      row.idleShortA = demand - row.idleA;
      return ` At idle it gives only about ${fmt(row.idleA, 0)} A (${Math.round((100 * row.idleA) / row.ratedA)} % of its rating), ${fmt(row.idleShortA)} A short of the loads: a long idle runs ${them} down.`;
    }
    return ` At idle (about ${fmt(row.idleA, 0)} A) it still covers the loads.`;
  };
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
    row.message = `${name}: the loads want ${fmt(row.demandA)} A; the charging system gives ${fmt(row.alternatorA)} A of its ${fmt(row.ratedA, 0)} A rating, so ${them} ${batteries > 1 ? "make" : "makes"} up ${fmt(deficit)} A and ${batteries > 1 ? "are" : "is"} running down.${runtime}${idleNote(row.demandA)}`;
  } else if (limited || row.alternatorA > 0.9 * row.ratedA) {
    row.verdict = "at-limit";
    row.message = `${name}: the charging system keeps up, but at ${fmt(row.alternatorA)} A of its ${fmt(row.ratedA, 0)} A rating there is little to spare; an alternator at full output runs hot (common practice (no source)).${idleNote(row.alternatorA)}`;
  } else {
    row.verdict = "keeps-up";
    row.message = `${name}: the charging system keeps up with ${fmt(row.ratedA - row.alternatorA)} A to spare (${fmt(row.alternatorA)} A of ${fmt(row.ratedA, 0)} A).${idleNote(row.alternatorA)}`;
  }
  return row;
}

/** The supply balance in every state of a circuit: the total load against the alternators and the batteries. */
export function supplyCheck(doc: CircuitDocument): SupplyRow[] {
  return stateIdsOf(doc).map((id) => supplyRow(doc, id, solveCircuit(doc, { state: id })));
}
