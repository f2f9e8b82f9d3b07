import { CIRCUIT_DEFAULTS, stateIdsOf, type CircuitDocument } from "@/lib/circuit";
import { solveCircuit, type SolveResult } from "@/lib/solver";
import { chargingWindowAtV, REFERENCE_TEMP_C, stateOfChargePercent } from "./limits";

/**
 * How far a reading may sit from the model and still count as "as predicted": 10 % of the prediction or 20 mV,
 * whichever is larger. Ampwright's own allowance for meter and model error (no source).
 */
export const READING_TOLERANCE = { fraction: 0.1, minimumV: 0.02 } as const;

/**
 * Extra resistance heating a joint by more than this is flagged: a few watts in one crimp or lug is enough to
 * discolour insulation and loosen a terminal. Common practice (no source).
 */
export const JOINT_HEAT_WARNING_W = 5;

export type Reading = { id: string; stateId: string; positive: string; negative: string; value: number; unit: "V" | "mV"; currentA: number | null };

export type PathFigures = {
  /** Cables and connections between the two probes, in order from the red lead. */
  ids: string[];
  expectedOhm: number;
  /** The current through the path, from the clamp meter if one was read, else from the model. */
  currentA: number;
  currentFrom: "clamp" | "model";
  impliedOhm: number;
  /** Resistance the reading says is there beyond the model's (0 when it is not more). */
  excessOhm: number;
  /** I^2 R of the excess, in watts. */
  excessHeatW: number;
  heatWarning?: string;
};

export type ReadingCheck = {
  id: string;
  measuredV: number;
  expectedV?: number;
  differenceV?: number;
  verdict: "as-predicted" | "higher" | "lower" | "no-model";
  /** Why there is no prediction, when there is none. */
  reason?: string;
  path?: PathFigures;
  /** The cables and connections between the probes, in order from the red lead, even when no resistance follows. */
  spans?: string[];
  /** Why no resistance could be worked out along the probes' path. */
  pathNote?: string;
  /** Across a battery's own posts: its state of charge at rest, or the charging voltage against the window. */
  battery?: { kind: "rest"; socPercent: number } | { kind: "charging"; window: [number, number]; within: boolean; tempC: number };
};

type Edge = { id: string; a: string; b: string; ohm: number; current: number };

/** The passive parts (cables, connections, fuses, closed switches) as edges between terminals, with solved currents. */
function passiveEdges(doc: CircuitDocument, result: SolveResult, stateId: string): Edge[] {
  const edges: Edge[] = [];
  for (const w of doc.wires) {
    const r = result.wires[w.id];
    if (r) edges.push({ id: w.id, a: w.from, b: w.to, ohm: r.resistance, current: r.current });
  }
  const overrides = doc.states?.find((s) => s.id === stateId)?.set ?? {};
  for (const c0 of doc.components) {
    const c = { ...c0, ...(overrides[c0.id] ?? {}) } as typeof c0;
    const r = result.components[c.id];
    if (!r || r.current === undefined) continue;
    let ohm: number | undefined;
    if (c.kind === "joint" || c.kind === "fuse") ohm = c.resistance;
    else if (c.kind === "switch" && (c.closed ?? CIRCUIT_DEFAULTS.closed)) ohm = c.contactResistance;
    if (ohm === undefined) continue;
    edges.push({ id: c.id, a: `${c.id}.a`, b: `${c.id}.b`, ohm, current: r.current });
  }
  return edges;
}

/** The shortest run of passive parts from one terminal to another (breadth first), with each part's direction. */
function findPath(edges: Edge[], from: string, to: string): { edge: Edge; forward: boolean }[] | undefined {
  const adj = new Map<string, { edge: Edge; forward: boolean; next: string }[]>();
  for (const e of edges) {
    adj.set(e.a, [...(adj.get(e.a) ?? []), { edge: e, forward: true, next: e.b }]);
    adj.set(e.b, [...(adj.get(e.b) ?? []), { edge: e, forward: false, next: e.a }]);
  }
  const prev = new Map<string, { node: string; edge: Edge; forward: boolean }>();
  const queue = [from];
  const seen = new Set([from]);
  while (queue.length) {
    const n = queue.shift()!;
    if (n === to) break;
    for (const step of adj.get(n) ?? []) {
      if (seen.has(step.next)) continue;
      seen.add(step.next);
      prev.set(step.next, { node: n, edge: step.edge, forward: step.forward });
      queue.push(step.next);
    }
  }
  if (!prev.has(to)) return undefined;
  const steps: { edge: Edge; forward: boolean }[] = [];
  for (let n = to; n !== from; ) {
    const p = prev.get(n)!;
    steps.unshift({ edge: p.edge, forward: p.forward });
    n = p.node;
  }
  return steps;
}

/**
 * Each reading against the solved circuit of its operating state: the predicted voltage between the same two
 * points, the difference and a verdict; and, when the probes span a run of cables and connections carrying one
 * current, the resistance the reading implies (V / I), the excess over the model and the heat that excess makes.
 */
export function checkReadings(doc: CircuitDocument, readings: Reading[]): ReadingCheck[] {
  const results = new Map<string, SolveResult>();
  const states = new Set(stateIdsOf(doc));
  return readings.map((r) => {
    const measuredV = r.unit === "mV" ? r.value / 1000 : r.value;
    if (!states.has(r.stateId)) return { id: r.id, measuredV, verdict: "no-model", reason: `the circuit has no state "${r.stateId}" any more` };
    let result = results.get(r.stateId);
    if (!result) {
      result = solveCircuit(doc, { state: r.stateId });
      results.set(r.stateId, result);
    }
    const vp = result.terminals[r.positive];
    const vn = result.terminals[r.negative];
    if (result.status !== "ok") return { id: r.id, measuredV, verdict: "no-model", reason: "the circuit has no trustworthy solution in this state (see its problems)" };
    if (vp === undefined || vn === undefined) return { id: r.id, measuredV, verdict: "no-model", reason: "a probed point is no longer in the circuit" };
    const expectedV = vp - vn;
    const differenceV = measuredV - expectedV;
    const allowed = Math.max(READING_TOLERANCE.minimumV, READING_TOLERANCE.fraction * Math.abs(expectedV));
    const verdict = Math.abs(differenceV) <= allowed ? "as-predicted" : Math.abs(measuredV) > Math.abs(expectedV) ? "higher" : "lower";
    const check: ReadingCheck = { id: r.id, measuredV, expectedV, differenceV, verdict };

    const [pid, pt] = r.positive.split(".");
    const [nid, nt] = r.negative.split(".");
    const battery = pid === nid && pt === "pos" && nt === "neg" ? doc.components.find((c) => c.id === pid && c.kind === "battery") : undefined;
    if (battery) {
      const charging = Object.values(result.components).some((c) => c.mode === "regulating" || c.mode === "current-limit");
      const batteryI = result.components[battery.id]?.current ?? 0;
      if (charging) {
        const tempC = doc.ambientC ?? REFERENCE_TEMP_C;
        const window = chargingWindowAtV(doc.systemVoltage, tempC);
        check.battery = { kind: "charging", window, within: measuredV >= window[0] && measuredV <= window[1], tempC };
      } else if (Math.abs(batteryI) < 1) {
        check.battery = { kind: "rest", socPercent: stateOfChargePercent(measuredV, doc.systemVoltage) };
      }
    }

    const steps = findPath(passiveEdges(doc, result, r.stateId), r.positive, r.negative);
    if (!steps || !steps.length) {
      check.pathNote = "the probes do not span only cables and connections, so no resistance is worked out";
      return check;
    }
    check.spans = steps.map((s) => s.edge.id);
    // Current along the path, signed in the direction from the red lead.
    const along = steps.map((s) => (s.forward ? s.edge.current : -s.edge.current));
    const modelI = along[0];
    const uniform = along.every((i) => Math.abs(i - modelI) <= 0.02 * Math.max(Math.abs(modelI), 1e-9));
    if (!uniform) {
      // One current is needed for V / I to be a resistance; a branch on the way splits it.
      check.pathNote = "the current changes along this path (a branch joins it), so no single resistance follows: split the path at the branch and measure each part";
      return check;
    }
    const currentA = r.currentA !== null ? Math.abs(r.currentA) : Math.abs(modelI);
    if (currentA < 0.01) {
      check.pathNote = "almost no current flows here in this state, so a drop cannot show a resistance: measure under load";
      return check;
    }
    const expectedOhm = steps.reduce((sum, s) => sum + s.edge.ohm, 0);
    const impliedOhm = Math.abs(measuredV) / currentA;
    const excessOhm = Math.max(0, impliedOhm - expectedOhm);
    const excessHeatW = currentA * currentA * excessOhm;
    check.path = {
      ids: steps.map((s) => s.edge.id),
      expectedOhm,
      currentA,
      currentFrom: r.currentA !== null ? "clamp" : "model",
      impliedOhm,
      excessOhm,
      excessHeatW,
      ...(excessHeatW > JOINT_HEAT_WARNING_W
        ? { heatWarning: `The extra resistance turns about ${excessHeatW.toFixed(0)} W into heat at one spot: enough to char insulation or loosen a terminal. Find it and repair it.` }
        : {}),
    };
    return check;
  });
}
