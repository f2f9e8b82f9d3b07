import { lusolve } from "mathjs";
import type { CircuitDocument } from "@/lib/circuit";
import { checkReadings, type Reading } from "./compare";

export type Suspect = {
  id: string;
  /** Estimated resistance beyond the model's, ohms (never negative). */
  extraOhm: number;
  /** How many readings span this part. */
  readings: number;
  /** Parts the readings cannot tell apart from this one (they always appear together). */
  twins: string[];
};

export type Location = {
  suspects: Suspect[];
  /** Readings that could be used (they span one current through cables and connections). */
  used: string[];
  /** Where to put a probe next to split parts the readings cannot tell apart, when there are such. */
  probeNext?: { between: [string, string]; at: string; why: string };
  /** Root-mean-square misfit of the readings after the estimate, volts. */
  residualV: number;
};

/**
 * Non-negative least squares (Lawson and Hanson's active-set method) for small systems: minimise |A x - b| with
 * x >= 0. The unconstrained subproblems go through mathjs's lusolve on the normal equations.
 */
export function nnls(A: number[][], b: number[], maxIterations = 200): number[] {
  const n = A[0]?.length ?? 0;
  const x = new Array<number>(n).fill(0);
  const passive = new Set<number>();
  const grad = () => Array.from({ length: n }, (_, j) => A.reduce((s, row, i) => s + row[j] * (b[i] - row.reduce((t, a, k) => t + a * x[k], 0)), 0));
  const solveOn = (cols: number[]) => {
    const AtA = cols.map((p) => cols.map((q) => A.reduce((s, row) => s + row[p] * row[q], 0)));
    const Atb = cols.map((p) => A.reduce((s, row, i) => s + row[p] * b[i], 0));
    // A tiny ridge keeps the normal equations solvable when two columns are equal (parts always measured together).
    for (let i = 0; i < cols.length; i++) AtA[i][i] += 1e-12 * (1 + AtA[i][i]);
    return (lusolve(AtA, Atb) as number[][]).map((r) => r[0]);
  };
  for (let it = 0; it < maxIterations; it++) {
    const w = grad();
    let best = -1;
    for (let j = 0; j < n; j++) if (!passive.has(j) && w[j] > 1e-12 && (best < 0 || w[j] > w[best])) best = j;
    if (best < 0) break;
    passive.add(best);
    for (let inner = 0; inner < maxIterations; inner++) {
      const cols = [...passive];
      const z = solveOn(cols);
      if (z.every((v) => v > 0)) {
        cols.forEach((c, i) => (x[c] = z[i]));
        break;
      }
      let alpha = Infinity;
      cols.forEach((c, i) => {
        if (z[i] <= 0) alpha = Math.min(alpha, x[c] / (x[c] - z[i]));
      });
      cols.forEach((c, i) => (x[c] = x[c] + alpha * (z[i] - x[c])));
      for (const c of cols) if (x[c] <= 1e-15) passive.delete(c);
    }
  }
  return x.map((v) => Math.max(0, v));
}

/**
 * Which cables and connections carry resistance the model does not have, from readings along the circuit. Each
 * reading that spans one current gives an equation: measured drop = I (model resistance of its run + the extra of
 * each part on it). The extras are found by non-negative least squares, so no part is credited with negative
 * resistance. First-order: the extra is assumed too small to change the currents much (a clamp reading avoids it).
 */
export function locateFault(doc: CircuitDocument, readings: Reading[]): Location {
  const checks = checkReadings(doc, readings).filter((c) => c.path);
  // Zero-ohm links only say two terminals are one point; they are not parts that can go bad.
  const links = new Set(doc.wires.filter((w) => w.resistanceOhm === 0).map((w) => w.id));
  const ids = [...new Set(checks.flatMap((c) => c.path!.ids))].filter((id) => !links.has(id));
  const A = checks.map((c) => ids.map((id) => (c.path!.ids.includes(id) ? c.path!.currentA : 0)));
  const b = checks.map((c) => Math.abs(c.measuredV) - c.path!.currentA * c.path!.expectedOhm);
  const x = ids.length && checks.length ? nnls(A, b) : [];
  const residual = checks.length ? Math.sqrt(A.reduce((s, row, i) => s + (row.reduce((t, a, k) => t + a * x[k], 0) - b[i]) ** 2, 0) / checks.length) : 0;

  // Parts that appear in exactly the same readings cannot be told apart by them.
  const signature = (k: number) => checks.map((c) => (c.path!.ids.includes(ids[k]) ? 1 : 0)).join("");
  const suspects: Suspect[] = ids
    .map((id, k) => ({
      id,
      extraOhm: x[k],
      readings: checks.filter((c) => c.path!.ids.includes(id)).length,
      twins: ids.filter((other, j) => j !== k && signature(j) === signature(k)),
    }))
    .filter((s) => s.extraOhm > 1e-6)
    .sort((p, q) => q.extraOhm - p.extraOhm);

  let probeNext: Location["probeNext"];
  const top = suspects[0];
  if (top && top.twins.length) {
    // Probe the terminal between the top suspect and a twin next to it on a reading's path.
    const path = checks.find((c) => c.path!.ids.includes(top.id))!.path!.ids.filter((id) => !links.has(id));
    const i = path.indexOf(top.id);
    const neighbour = [path[i + 1], path[i - 1]].find((n) => n && top.twins.includes(n));
    if (neighbour) {
      const at = sharedTerminal(doc, top.id, neighbour);
      if (at) probeNext = { between: [top.id, neighbour], at, why: `${top.id} and ${neighbour} are always measured together; a reading to ${at} splits them.` };
    }
  }
  return { suspects, used: checks.map((c) => c.id), probeNext, residualV: residual };
}

/** The terminal where two neighbouring parts meet (a wire's end on a part, or two wires on one terminal). */
function sharedTerminal(doc: CircuitDocument, a: string, b: string): string | undefined {
  const ends = (id: string): string[] => {
    const w = doc.wires.find((x) => x.id === id);
    return w ? [w.from, w.to] : [`${id}.a`, `${id}.b`];
  };
  const ea = ends(a);
  return ends(b).find((t) => ea.includes(t));
}
