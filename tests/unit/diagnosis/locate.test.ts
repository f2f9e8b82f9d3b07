import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { pickupCharging } from "@/db/demo-work";
import { locateFault, nnls } from "@/lib/diagnosis/locate";
import { solveCircuit } from "@/lib/solver";

const good = { ...pickupCharging, components: pickupCharging.components.map((c) => (c.id === "JAC" ? { ...c, resistance: 0.0004 } : c)) };
const r = (id: string, positive: string, negative: string, value: number, currentA: number) => ({ id, stateId: "charge", positive, negative, value, unit: "V" as const, currentA });

describe("non-negative least squares", () => {
  it("solves a consistent system exactly and never goes negative", () => {
    // Worked by hand: x1 = 1, x2 = 2 satisfies both rows.
    expect(nnls([[1, 0], [1, 1]], [1, 3]).map((v) => +v.toFixed(9))).toEqual([1, 2]);
    // The unconstrained answer would put x2 below zero; the constrained one stops at 0.
    const x = nnls([[1, 1], [1, 0]], [1, 2]);
    expect(x[1]).toBe(0);
    expect(x[0]).toBeCloseTo(1.5, 9); // minimises (x1 - 1)^2 + (x1 - 2)^2
  });

  it("property: the answer is non-negative and no worse than any non-negative point tried", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.double({ min: 0, max: 50, noNaN: true }), { minLength: 3, maxLength: 3 }), { minLength: 3, maxLength: 6 }), fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 6, maxLength: 6 }), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }), (A, b6, probe) => {
        const b = b6.slice(0, A.length);
        const x = nnls(A, b);
        const cost = (v: number[]) => A.reduce((s, row, i) => s + (row.reduce((t, a, k) => t + a * v[k], 0) - b[i]) ** 2, 0);
        expect(x.every((v) => v >= 0)).toBe(true);
        expect(cost(x)).toBeLessThanOrEqual(cost(probe) + 1e-6 * (1 + cost(probe)));
      }),
      { numRuns: 200, seed: 7 },
    );
  });
});

describe("locating extra resistance from readings", () => {
  it("puts the excess on the bracket when the battery-ground run reads as the model does", () => {
    // Hand arithmetic (Ohm's law): block to case reads 1.68 V at 49 A, so the run holds 1.68 / 49 = 34.29 mOhm;
    // the model's run is the 0.4 mOhm bracket, so 33.89 mOhm is extra. Battery - to block reads 12 mV at 15 A
    // where the model's 0.2 + 0.605 mOhm predicts 12.1 mV: nothing extra there.
    const loc = locateFault(good, [r("a", "GE.t", "A1.case", 1.68, 49), r("b", "B1.neg", "GE.t", 0.012, 15)]);
    expect(loc.suspects[0].id).toBe("JAC");
    expect(loc.suspects[0].extraOhm).toBeCloseTo(1.68 / 49 - 0.0004, 9);
    expect(loc.suspects.map((s) => s.id)).not.toContain("W6");
    expect(loc.used).toEqual(["a", "b"]);
  });

  it("says when two parts cannot be told apart, and where to probe to split them", () => {
    // B+ fuse to the alternator's B+ spans the B+ cable W2 and the stud nut JAB: one reading cannot split them.
    const loc = locateFault(good, [r("a", "F1.b", "A1.out", -0.5, -49)]);
    const top = loc.suspects[0];
    expect(top.twins.length).toBe(1);
    expect(loc.probeNext?.at).toBe("JAB.a");
  });

  it("finds a single bad ground joint from three readings, one across each part of the ground side", () => {
    // Clamp 49 A on the alternator's return, 15 A on the battery ground cable (invented demo readings).
    // JBN: 0.2 mOhm x 15 A = 3 mV as designed; W6: its model resistance x 15 A as designed; the bracket reads
    // 1.68 V at 49 A = 34.29 mOhm against 0.4 mOhm designed.
    const rW6 = solveCircuit(good, { state: "charge" }).wires.W6!.resistance;
    const loc = locateFault(good, [r("a", "GE.t", "A1.case", 1.68, 49), r("b", "B1.neg", "JBN.a", 0.2e-3 * 15, 15), r("c", "JBN.a", "GE.t", rW6 * 15, 15)]);
    expect(loc.suspects.map((s) => s.id)).toEqual(["JAC"]);
    expect(loc.suspects[0]!.extraOhm).toBeCloseTo(1.68 / 49 - 0.0004, 9);
    expect(loc.suspects[0]!.twins).toEqual([]);
  });

  it("separates two suspects in series with the extra reading it asked for", () => {
    // First: 0.5 V over the B+ cable W2 and the stud nut JAB together at 49 A. Then, at the point it named (JAB.a),
    // the cable alone reads as designed (its model resistance x 49 A), so the whole excess is the nut's:
    // 0.5 / 49 - R(W2) - 0.4 mOhm.
    const rW2 = solveCircuit(good, { state: "charge" }).wires.W2!.resistance;
    const first = locateFault(good, [r("a", "F1.b", "A1.out", -0.5, -49)]);
    expect(first.probeNext?.at).toBe("JAB.a");
    const second = locateFault(good, [r("a", "F1.b", "A1.out", -0.5, -49), r("b", "F1.b", "JAB.a", -rW2 * 49, -49)]);
    expect(second.suspects.map((s) => s.id)).toEqual(["JAB"]);
    expect(second.suspects[0]!.twins).toEqual([]);
    expect(second.suspects[0]!.extraOhm).toBeCloseTo(0.5 / 49 - rW2 - 0.0004, 9);
    expect(second.probeNext).toBeUndefined();
  });

  it("names no suspect when every reading is what the healthy circuit predicts", () => {
    const model = solveCircuit(good, { state: "charge" });
    const v = (p: string, n: string) => model.terminals[p]! - model.terminals[n]!;
    const pairs: [string, string][] = [["GE.t", "A1.case"], ["B1.neg", "JBN.a"], ["JBN.a", "GE.t"], ["F1.b", "JAB.a"], ["JAB.a", "A1.out"]];
    const loc = locateFault(good, pairs.map(([p, n], i) => ({ id: `h${i}`, stateId: "charge", positive: p, negative: n, value: v(p, n), unit: "V" as const, currentA: null })));
    expect(loc.used.length).toBe(5);
    expect(loc.suspects).toEqual([]);
    expect(loc.residualV).toBeLessThan(1e-9);
  });
});
