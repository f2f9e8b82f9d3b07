import { describe, expect, it } from "vitest";
import { solveCircuit } from "@/lib/solver";
import { circuit } from "../../support/circuits";

// Every expected value below is worked by hand from Ohm's and Kirchhoff's laws (arithmetic beside it).

describe("a battery feeding a load through a cable and a joint", () => {
  const doc = circuit(
    [
      { id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.02 },
      { id: "J1", kind: "joint", resistance: 0.05 },
      { id: "L1", kind: "load", mode: "resistance", value: 1 },
      { id: "G1", kind: "ground" },
    ],
    [
      { id: "W1", from: "B1.pos", to: "J1.a", resistanceOhm: 0.03 },
      { id: "W2", from: "J1.b", to: "L1.pos", size: "10 AWG", lengthM: 2 },
      { id: "W3", from: "L1.neg", to: "G1.t", resistanceOhm: 0.01 },
      { id: "W4", from: "G1.t", to: "B1.neg", resistanceOhm: 0.01 },
    ],
  );
  // W2: 10 AWG copper at 25 C (default ambient). ASTM B258: d = 0.005 in x 92^(26/39) = 0.10189 in = 2.5882 mm,
  // area 5.2612 mm2; IEC 60028: 1.7241e-8 ohm m / 5.2612e-6 m2 = 3.2770e-3 ohm/m (NBS prints 0.9989 ohm/kft =
  // 3.2772e-3); x 1.02 stranding x (1 + 0.00393 x 5) = 3.4082e-3 ohm/m; x 2 m = 6.8165e-3 ohm.
  const d = 0.005 * 0.0254 * Math.pow(92, 26 / 39);
  const rW2 = (1.7241e-8 / ((Math.PI / 4) * d * d)) * 1.02 * (1 + 0.00393 * 5) * 2;
  // Loop: 0.02 + 0.03 + 0.05 + rW2 + 1 + 0.01 + 0.01 = 1.12 + rW2 ohm; I = 12.6 / (1.12 + rW2).
  const I = 12.6 / (1.12 + rW2);
  const r = solveCircuit(doc);

  it("solves with no issues", () => {
    expect(r.status).toBe("ok");
    expect(r.issues).toEqual([]);
    expect(r.reference).toBe("B1.neg");
  });
  it("carries the loop current everywhere", () => {
    expect(r.wires.W1.current).toBeCloseTo(I, 9);
    expect(r.components.L1.current).toBeCloseTo(I, 9);
    expect(r.components.B1.current).toBeCloseTo(-I, 9); // discharging: current flows out of the positive
  });
  it("puts the drops where the resistance is", () => {
    expect(r.wires.W2.resistance).toBeCloseTo(rW2, 7);
    expect(r.components.J1.voltage).toBeCloseTo(0.05 * I, 9); // the joint: 0.05 ohm x I
    expect(r.wires.W4.drop).toBeCloseTo(0.01 * I, 9); // the ground side: G1 sits 0.01 x I above B1.neg
    expect(r.terminals["B1.pos"]).toBeCloseTo(12.6 - 0.02 * I, 9); // terminal voltage under load
    expect(r.components.L1.voltage).toBeCloseTo(1 * I, 9);
    expect(r.wires.W1.dropPercent).toBeCloseTo((100 * 0.03 * I) / 12, 9);
  });
  it("signs power as the contract says", () => {
    expect(r.components.B1.power).toBeCloseTo(-(12.6 - 0.02 * I) * I, 8); // delivering: negative
    expect(r.components.L1.power).toBeCloseTo(I * I * 1, 8);
    expect(r.wires.W1.power).toBeCloseTo(I * I * 0.03, 9);
  });
});

describe("two batteries in parallel feeding a starter", () => {
  const doc = circuit(
    [
      { id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.01 },
      { id: "B2", kind: "battery", openCircuitVoltage: 12.5, internalResistance: 0.012 },
      { id: "S", kind: "junction" },
      { id: "M1", kind: "starter", current: 400 },
      { id: "G1", kind: "ground", reference: true },
    ],
    [
      { id: "P1", from: "B1.pos", to: "S.t", resistanceOhm: 0.002 },
      { id: "P2", from: "B2.pos", to: "S.t", resistanceOhm: 0.002 },
      { id: "N1", from: "B1.neg", to: "G1.t", resistanceOhm: 0.001 },
      { id: "N2", from: "B2.neg", to: "G1.t", resistanceOhm: 0.001 },
      { id: "F", from: "S.t", to: "M1.in", resistanceOhm: 0.003 },
      { id: "R", from: "M1.case", to: "G1.t", resistanceOhm: 0.002 },
    ],
  );
  // Branch resistances to the junction: R1 = 0.01 + 0.002 + 0.001 = 0.013, R2 = 0.012 + 0.002 + 0.001 = 0.015.
  // KCL at S: (12.6 - Vs)/R1 + (12.5 - Vs)/R2 = 400 -> Vs = (12.6/R1 + 12.5/R2 - 400) / (1/R1 + 1/R2) = 9.76786 V.
  const R1 = 0.013;
  const R2 = 0.015;
  const Vs = (12.6 / R1 + 12.5 / R2 - 400) / (1 / R1 + 1 / R2);
  const r = solveCircuit(doc);

  it("splits the cranking current by the branch resistances", () => {
    expect(r.status).toBe("ok");
    expect(r.reference).toBe("G1.t");
    expect(r.terminals["S.t"]).toBeCloseTo(Vs, 9);
    expect(-r.components.B1.current!).toBeCloseTo((12.6 - Vs) / R1, 8);
    expect(-r.components.B2.current!).toBeCloseTo((12.5 - Vs) / R2, 8);
    expect(r.components.M1.current).toBe(400);
  });
  it("leaves the starter the supply less its feed and return drops", () => {
    // 400 A x 0.003 ohm feed = 1.2 V; 400 A x 0.002 ohm return = 0.8 V.
    expect(r.components.M1.voltage).toBeCloseTo(Vs - 1.2 - 0.8, 9);
    expect(r.wires.R.drop).toBeCloseTo(0.8, 12);
  });
});

describe("an alternator charging two batteries", () => {
  const build = (rated: number) =>
    circuit(
      [
        { id: "A1", kind: "alternator", regulatedVoltage: 14.4, ratedCurrent: rated },
        { id: "B1", kind: "battery", openCircuitVoltage: 12.4, internalResistance: 0.05 },
        { id: "B2", kind: "battery", openCircuitVoltage: 12.3, internalResistance: 0.05 },
        { id: "G1", kind: "ground", reference: true },
      ],
      [
        { id: "C1", from: "A1.out", to: "B1.pos", resistanceOhm: 0.005 },
        { id: "C2", from: "A1.out", to: "B2.pos", resistanceOhm: 0.005 },
        { id: "K", from: "A1.case", to: "G1.t", resistanceOhm: 0 },
        { id: "N1", from: "B1.neg", to: "G1.t", resistanceOhm: 0.001 },
        { id: "N2", from: "B2.neg", to: "G1.t", resistanceOhm: 0.001 },
      ],
    );

  it("in regulation: holds 14.4 V and each battery takes (14.4 - E) / 0.056 ohm", () => {
    // Each path: 0.005 cable + 0.05 internal + 0.001 ground = 0.056 ohm. B1: 2.0 / 0.056 = 35.714 A;
    // B2: 2.1 / 0.056 = 37.5 A; total 73.214 A, under the 150 A rating.
    const r = solveCircuit(build(150));
    expect(r.status).toBe("ok");
    expect(r.components.A1.mode).toBe("regulating");
    expect(r.components.A1.voltage).toBeCloseTo(14.4, 12);
    expect(r.components.B1.current).toBeCloseTo(2.0 / 0.056, 9);
    expect(r.components.B2.current).toBeCloseTo(2.1 / 0.056, 9);
    expect(r.components.A1.current).toBeCloseTo(-(2.0 + 2.1) / 0.056, 9);
    expect(r.components.A1.power!).toBeLessThan(0);
  });

  it("at its current limit: delivers exactly the rating and the voltage falls below regulation", () => {
    // 50 A shared: (V - 12.4)/0.056 + (V - 12.3)/0.056 = 50 -> V = (50 x 0.056 + 24.7) / 2 = 13.75 V.
    const r = solveCircuit(build(50));
    expect(r.status).toBe("ok");
    expect(r.components.A1.mode).toBe("current-limit");
    expect(r.components.A1.current).toBeCloseTo(-50, 12);
    expect(r.terminals["A1.out"]).toBeCloseTo(13.75, 9);
    expect(r.activeSetPasses).toBe(2);
  });

  it("blocks reverse current when the batteries stand above its regulated voltage", () => {
    const doc = build(150);
    doc.components[0] = { id: "A1", kind: "alternator", regulatedVoltage: 12.0, ratedCurrent: 150 };
    const r = solveCircuit(doc);
    expect(r.components.A1.mode).toBe("blocked");
    expect(r.components.A1.current).toBe(0);
    // With the alternator out, B1 charges B2: (12.4 - 12.3) / (2 x 0.056) = 0.893 A.
    expect(r.components.B2.current).toBeCloseTo(0.1 / 0.112, 9);
  });
});

describe("operating states", () => {
  const doc = circuit(
    [
      { id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.01 },
      { id: "L1", kind: "load", mode: "current", value: 10 },
      { id: "M1", kind: "starter", current: 300, enabled: false },
    ],
    [
      { id: "W1", from: "B1.pos", to: "L1.pos", resistanceOhm: 0.01 },
      { id: "W2", from: "L1.neg", to: "B1.neg", resistanceOhm: 0.01 },
      { id: "W3", from: "B1.pos", to: "M1.in", resistanceOhm: 0.002 },
      { id: "W4", from: "M1.case", to: "B1.neg", resistanceOhm: 0.002 },
    ],
    { states: [{ id: "crank", name: "Cranking", set: { M1: { enabled: true }, L1: { value: 2 } } }] },
  );
  it("applies a state's overrides and leaves the base as written", () => {
    const base = solveCircuit(doc);
    expect(base.components.M1.current).toBe(0);
    expect(base.terminals["B1.pos"]).toBeCloseTo(12.6 - 0.01 * 10, 12); // 10 A x 0.01 ohm internal
    const crank = solveCircuit(doc, { state: "crank" });
    expect(crank.state).toBe("crank");
    expect(crank.terminals["B1.pos"]).toBeCloseTo(12.6 - 0.01 * 302, 12); // 302 A x 0.01 ohm internal
  });
});

describe("a constant-power load", () => {
  // 120 W from 12.6 V behind 0.1 ohm: V = 12.6 - 0.1 x 120 / V -> V^2 - 12.6 V + 12 = 0 -> V = (12.6 + sqrt(158.76 - 48)) / 2.
  const doc = circuit(
    [
      { id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.05 },
      { id: "L1", kind: "load", mode: "power", value: 120 },
    ],
    [
      { id: "W1", from: "B1.pos", to: "L1.pos", resistanceOhm: 0.03 },
      { id: "W2", from: "L1.neg", to: "B1.neg", resistanceOhm: 0.02 },
    ],
  );
  it("converges to the higher root by Newton iteration", () => {
    const r = solveCircuit(doc);
    const V = (12.6 + Math.sqrt(12.6 * 12.6 - 4 * 0.1 * 120)) / 2;
    expect(r.status).toBe("ok");
    expect(r.components.L1.voltage).toBeCloseTo(V, 9);
    expect(r.components.L1.power).toBeCloseTo(120, 9);
    expect(r.components.L1.mode).toBe("constant-power");
    expect(r.iterations).toBeLessThan(10);
  });
  it("behaves as its resistance at half the system voltage when the supply collapses", () => {
    // 2,000 W cannot be had through 0.1 ohm from 12.6 V (the most is 12.6^2 / 0.4 = 397 W): below 6 V the load is
    // R = 6^2 / 2000 = 0.018 ohm, so I = 12.6 / 0.118 = 106.8 A and V = 1.922 V.
    const big = structuredClone(doc);
    big.components[1] = { id: "L1", kind: "load", mode: "power", value: 2000 };
    const r = solveCircuit(big);
    expect(r.components.L1.mode).toBe("collapsed");
    expect(r.components.L1.voltage).toBeCloseTo((12.6 * 0.018) / 0.118, 9);
    expect(r.issues.map((i) => i.code)).toContain("supply-collapse");
  });
});
