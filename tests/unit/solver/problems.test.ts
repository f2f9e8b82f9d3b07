import { describe, expect, it } from "vitest";
import { solveCircuit } from "@/lib/solver";
import { circuit } from "../../support/circuits";

const battery = { id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.01 };
const lamp = { id: "L1", kind: "load", mode: "resistance", value: 2 };
const good = [
  { id: "W1", from: "B1.pos", to: "L1.pos", resistanceOhm: 0.01 },
  { id: "W2", from: "L1.neg", to: "B1.neg", resistanceOhm: 0.01 },
];
const codes = (r: ReturnType<typeof solveCircuit>) => r.issues.map((i) => i.code);

describe("problems come back as issues a technician can act on", () => {
  it("unknown terminal reference", () => {
    const r = solveCircuit(circuit([battery, lamp], [...good, { id: "W3", from: "B1.plus", to: "L9.pos", resistanceOhm: 0.01 }]));
    const issue = r.issues.find((i) => i.code === "unknown-terminal")!;
    expect(issue.ids).toEqual(["W3"]);
    expect(issue.message).toMatch(/B1 is a battery with terminals B1\.pos, B1\.neg/);
    expect(r.status).toBe("error");
  });

  it("duplicate ids", () => {
    const r = solveCircuit(circuit([battery, lamp, { ...lamp, value: 4 }], good));
    expect(codes(r)).toContain("duplicate-id");
    expect(r.issues.find((i) => i.code === "duplicate-id")!.ids).toEqual(["L1"]);
  });

  it("a component left unconnected", () => {
    const r = solveCircuit(circuit([battery, lamp, { id: "L2", kind: "load", mode: "current", value: 3 }], good));
    expect(r.issues.find((i) => i.code === "unconnected")?.ids).toEqual(["L2"]);
    expect(r.status).toBe("ok"); // a warning: the rest is still solved
    expect(r.components.L1.current).toBeGreaterThan(0);
  });

  it("a section with no path to the reference names its components", () => {
    const r = solveCircuit(
      circuit(
        [battery, lamp, { id: "B2", kind: "battery", openCircuitVoltage: 12, internalResistance: 0.02 }, { id: "L2", kind: "load", mode: "resistance", value: 3 }],
        [...good, { id: "W3", from: "B2.pos", to: "L2.pos", resistanceOhm: 0.01 }, { id: "W4", from: "L2.neg", to: "B2.neg", resistanceOhm: 0.01 }],
      ),
    );
    const f = r.issues.find((i) => i.code === "floating-section")!;
    expect(f.ids.sort()).toEqual(["B2", "L2"]);
    // Its currents are still right: 12 / (0.02 + 0.01 + 3 + 0.01) A.
    expect(r.components.L2.current).toBeCloseTo(12 / 3.04, 9);
  });

  it("a load with no return path", () => {
    const r = solveCircuit(circuit([battery, lamp, { id: "M1", kind: "starter", current: 200 }], [...good, { id: "W3", from: "B1.pos", to: "M1.in", resistanceOhm: 0.002 }]));
    const issue = r.issues.find((i) => i.code === "no-return-path")!;
    expect(issue.ids).toEqual(["M1"]);
    expect(r.status).toBe("error");
    expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity/);
  });

  it("a dead short across a battery", () => {
    const r = solveCircuit(circuit([battery, lamp], [...good, { id: "W9", from: "B1.pos", to: "B1.neg", resistanceOhm: 0 }]));
    const issue = r.issues.find((i) => i.code === "dead-short")!;
    expect(issue.ids).toEqual(["B1"]);
    expect(issue.message).toMatch(/1260 A/); // 12.6 V / 0.01 ohm
    expect(r.status).toBe("error");
  });

  it("a loop of ideal sources", () => {
    const r = solveCircuit(
      circuit(
        [{ ...battery, internalResistance: 0 }, { id: "A1", kind: "alternator", regulatedVoltage: 14.2, ratedCurrent: 100 }, lamp],
        [...good, { id: "W3", from: "A1.out", to: "B1.pos", resistanceOhm: 0 }, { id: "W4", from: "A1.case", to: "B1.neg", resistanceOhm: 0 }],
      ),
    );
    const issue = r.issues.find((i) => i.code === "ideal-source-loop")!;
    expect(issue.ids.sort()).toEqual(["A1", "B1"]);
    expect(r.status).toBe("error");
  });

  it("a supply that collapses under a constant-power load", () => {
    const r = solveCircuit(circuit([{ ...battery, internalResistance: 0.2 }, { id: "L1", kind: "load", mode: "power", value: 3000 }], good));
    expect(codes(r)).toContain("supply-collapse");
    expect(r.components.L1.mode).toBe("collapsed");
  });

  it("non-convergence reports the residual", () => {
    const r = solveCircuit(circuit([battery, { id: "L1", kind: "load", mode: "power", value: 100 }], good), { maxNewtonIterations: 1 });
    const issue = r.issues.find((i) => i.code === "non-convergence")!;
    expect(issue.message).toMatch(/1 iterations, largest current mismatch .* A/);
    expect(r.converged).toBe(false);
    expect(r.status).toBe("error");
  });

  it("an unknown operating state, and a state that sets something impossible", () => {
    const doc = circuit([battery, lamp], good, { states: [{ id: "bad", name: "Bad", set: { L1: { value: -3 }, X9: { enabled: true } } }] });
    expect(codes(solveCircuit(doc, { state: "idle" }))).toEqual(["unknown-state"]);
    const r = solveCircuit(doc, { state: "bad" });
    expect(codes(r)).toEqual(expect.arrayContaining(["invalid-state-override", "unknown-component"]));
  });

  it("a fuse carrying more than its rating", () => {
    const r = solveCircuit(
      circuit([battery, lamp, { id: "F1", kind: "fuse", rating: 5, resistance: 0.002 }], [
        { id: "W1", from: "B1.pos", to: "F1.a", resistanceOhm: 0.01 },
        { id: "W1b", from: "F1.b", to: "L1.pos", resistanceOhm: 0.01 },
        good[1],
      ]),
    );
    expect(codes(r)).toContain("fuse-overload");
  });

  it("an open switch cuts its branch", () => {
    const r = solveCircuit(
      circuit([battery, lamp, { id: "S1", kind: "switch", closed: false, contactResistance: 0.001 }], [
        { id: "W1", from: "B1.pos", to: "S1.a", resistanceOhm: 0.01 },
        { id: "W1b", from: "S1.b", to: "L1.pos", resistanceOhm: 0.01 },
        good[1],
      ]),
    );
    expect(r.components.L1.current).toBe(0);
    expect(r.components.S1.mode).toBe("open");
    expect(r.components.S1.voltage).toBeCloseTo(12.6, 12);
  });
});
