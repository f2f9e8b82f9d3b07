import { describe, expect, it } from "vitest";
import { circuitSchemaV1, type CircuitDocument } from "@/lib/circuit";
import { sizeCable } from "@/lib/conductors";
import { solveCircuit } from "@/lib/solver";
import { planAddedLoad, tapChoices, TAP_LEAD_M, type AddLoadInput } from "@/lib/workspace/add-load";
import { supplyCheck, USABLE_FRACTION } from "@/lib/workspace/supply";

// Demo-style circuit (invented values): one battery, an alternator on the battery post, a ground point.
function truck(opts: { ratedA?: number; capacityAh?: number; alternator?: boolean } = {}): CircuitDocument {
  return {
    schema: "ampwright.circuit/1",
    name: "Service body",
    systemVoltage: 12,
    components: [
      { id: "B1", kind: "battery", position: { x: 0, y: 0 }, openCircuitVoltage: 12.6, internalResistance: 0.01, ...(opts.capacityAh ? { capacityAh: opts.capacityAh } : {}) },
      ...(opts.alternator === false ? [] : [{ id: "A1", kind: "alternator" as const, position: { x: 300, y: 0 }, regulatedVoltage: 14.2, ratedCurrent: opts.ratedA ?? 200, enabled: true }]),
      { id: "N1", kind: "junction", position: { x: 150, y: -100 } },
      { id: "G1", kind: "ground", position: { x: 150, y: 200 }, reference: true },
    ],
    wires: [
      { id: "W1", from: "B1.pos", to: "N1.t", resistanceOhm: 0.001 },
      ...(opts.alternator === false
        ? []
        : [
            { id: "W2", from: "A1.out", to: "N1.t", resistanceOhm: 0.001 },
            { id: "W3", from: "A1.case", to: "G1.t", resistanceOhm: 0 },
          ]),
      { id: "W4", from: "B1.neg", to: "G1.t", resistanceOhm: 0 },
    ],
    states: [{ id: "charging", name: "Charging", set: { A1: { enabled: true } } }],
  };
}

const winch: AddLoadInput = {
  label: "Winch",
  tap: "N1.t",
  ground: "G1.t",
  demand: { mode: "current", value: 150 },
  duty: { kind: "intermittent", onS: 60, periodS: 600 },
  feedLengthM: 4,
  groundLengthM: 4,
  zone: "underbody",
  insulation: "SGX",
  family: "awg",
  circuitClass: "non-critical",
  fromState: "charging",
  stateName: "Winch pulling",
};

describe("adding a load to a circuit", () => {
  it("adds a fuse at the tap, a feed and a ground of the engine's size, and a state with the load on", () => {
    const doc = truck();
    const plan = planAddedLoad(doc, winch);
    if (!plan.ok) throw new Error(plan.message);
    // The same request the quick sizing page would make for this run (the mean of feed, ground and tap lead).
    const direct = sizeCable({ systemVoltage: 12, currentA: 150, lengthM: (4 + 4 + TAP_LEAD_M) / 2, circuitClass: "non-critical", zone: "underbody", insulationRatingC: 125, family: "awg", duty: winch.duty, returnPath: "two-wire" });
    expect(plan.size).toBe(direct.recommended!.size);
    expect(plan.fuseA).toBe(direct.protection!.ratingA);
    expect(() => circuitSchemaV1.parse(plan.doc)).not.toThrow();
    const fuse = plan.doc.components.find((c) => c.id === plan.ids.fuse)!;
    const load = plan.doc.components.find((c) => c.id === plan.ids.load)!;
    expect(fuse).toMatchObject({ kind: "fuse", rating: plan.fuseA });
    expect(load).toMatchObject({ kind: "load", label: "Winch", enabled: false });
    const wires = plan.doc.wires.filter((w) => plan.ids.wires.includes(w.id));
    expect(wires.map((w) => [w.from, w.to, w.lengthM, w.size])).toEqual([
      ["N1.t", `${plan.ids.fuse}.a`, TAP_LEAD_M, plan.size],
      [`${plan.ids.fuse}.b`, `${plan.ids.load}.pos`, 4, plan.size],
      [`${plan.ids.load}.neg`, "G1.t", 4, plan.size],
    ]);
    const state = plan.doc.states!.find((s) => s.id === plan.stateId)!;
    expect(state.name).toBe("Winch pulling");
    // Made from Charging: its overrides are kept, and the winch is switched on.
    expect(state.set).toEqual({ A1: { enabled: true }, [plan.ids.load]: { enabled: true } });
    // The original is untouched.
    expect(doc.components).toHaveLength(4);
  });

  it("draws its current only in its own state, and sags the bus it taps", () => {
    const plan = planAddedLoad(truck({ ratedA: 400 }), winch);
    if (!plan.ok) throw new Error(plan.message);
    const off = solveCircuit(plan.doc, { state: "charging" });
    const on = solveCircuit(plan.doc, { state: plan.stateId });
    expect(off.components[plan.ids.load].mode).toBe("off");
    // A constant-current load of 150 A (arithmetic: the load's own setting).
    expect(on.components[plan.ids.load].current).toBeCloseTo(150, 6);
    expect(on.wires[plan.ids.wires[1]].current).toBeCloseTo(150, 6);
    // Arithmetic (KCL at N1): the 150 A comes out of what was charging the battery, so W1's current falls by it
    // as long as the 400 A alternator is not at its limit; and the bus voltage sags.
    expect(on.components.A1.mode).toBe("regulating");
    expect(on.terminals["N1.t"]).toBeLessThan(off.terminals["N1.t"]);
    const intoBattery = (r: typeof on) => r.components.B1.current!;
    const fromAlternator = (r: typeof on) => -r.components.A1.current!;
    expect(fromAlternator(on) - intoBattery(on)).toBeCloseTo(fromAlternator(off) - intoBattery(off) + 150, 6);
  });

  it("says what to fix and changes nothing on bad input", () => {
    const doc = truck();
    const cases: [Partial<AddLoadInput>, keyof AddLoadInput][] = [
      [{ tap: "Z9.pos" }, "tap"],
      [{ tap: "B1.neg2" }, "tap"],
      [{ ground: "N1.t" }, "ground"],
      [{ demand: { mode: "power", value: 0 } }, "demand"],
      [{ feedLengthM: 0 }, "feedLengthM"],
      [{ stateName: "  " }, "stateName"],
      [{ fromState: "towing" }, "fromState"],
    ];
    for (const [change, field] of cases) {
      const plan = planAddedLoad(doc, { ...winch, ...change });
      expect(plan.ok).toBe(false);
      if (!plan.ok) expect(plan.field).toBe(field);
    }
    // No AWG size carries 3000 A continuously: the engine's reason comes back.
    const huge = planAddedLoad(doc, { ...winch, demand: { mode: "current", value: 3000 }, duty: { kind: "continuous" } });
    expect(huge.ok).toBe(false);
    if (!huge.ok) expect(huge.message).toMatch(/No AWG size meets every limit/);
  });

  it("offers battery posts, bus bars and B+ to tap, and ground points and negatives to ground", () => {
    const { tap, ground } = tapChoices(truck());
    expect(tap.map((t) => t.ref)).toEqual(["B1.pos", "A1.out", "N1.t"]);
    expect(ground.map((t) => t.ref)).toEqual(["B1.neg", "N1.t", "G1.t"]);
  });
});

describe("the supply check", () => {
  it("a charging system with room to spare keeps up", () => {
    // Arithmetic (nodal analysis by hand): the alternator holds 14.2 V at A1.out; N1 is fed through 1 mOhm from it
    // and feeds the battery through 1 + 10 mOhm and a 20 A load. KCL at N1:
    // (14.2 - V) / 0.001 = (V - 12.6) / 0.011 + 20, so V = (14200 + 12.6 / 0.011 - 20) / (1000 + 1 / 0.011).
    const doc = truck({ ratedA: 200 });
    doc.components.push({ id: "L1", kind: "load", position: { x: 300, y: -200 }, mode: "current", value: 20, enabled: true });
    doc.wires.push({ id: "W5", from: "N1.t", to: "L1.pos", resistanceOhm: 0 }, { id: "W6", from: "L1.neg", to: "G1.t", resistanceOhm: 0 });
    const V = (14200 + 12.6 / 0.011 - 20) / (1000 + 1 / 0.011);
    const altA = (14.2 - V) / 0.001;
    const row = supplyCheck(doc).find((r) => r.stateId === "charging")!;
    expect(row.verdict).toBe("keeps-up");
    expect(row.alternatorA).toBeCloseTo(altA, 6);
    expect(row.demandA).toBeCloseTo(20, 9);
    expect(row.batteryA).toBeCloseTo((V - 12.6) / 0.011, 6);
    expect(row.message).toContain(`${(200 - altA).toFixed(1)} A to spare`);
  });

  it("a load beyond the alternator's rating runs the battery down, and says for how long", () => {
    // Arithmetic: 80 A of load against a 50 A alternator at its limit leaves 30 A for the battery. Peukert's law
    // (1897), t = H (C / (I H))^k with H = 20 h (SAE J537 20-hour rating, from memory), k = 1.25 (common practice):
    // 20 x (60 / 600)^1.25 = 1.1247 h to empty; half (USABLE_FRACTION, common practice (no source)) is 0.562 h, not the
    // 0.5 x 60 / 30 = 1 h that ignoring the discharge rate gave.
    const doc = truck({ ratedA: 50, capacityAh: 60 });
    doc.components.push({ id: "L1", kind: "load", position: { x: 300, y: -200 }, mode: "current", value: 80, enabled: true });
    doc.wires.push({ id: "W5", from: "N1.t", to: "L1.pos", resistanceOhm: 0 }, { id: "W6", from: "L1.neg", to: "G1.t", resistanceOhm: 0 });
    const row = supplyCheck(doc).find((r) => r.stateId === "charging")!;
    expect(USABLE_FRACTION).toBe(0.5);
    expect(row.verdict).toBe("deficit");
    expect(row.alternatorA).toBeCloseTo(50, 6);
    expect(row.batteryA).toBeCloseTo(-30, 6);
    expect(row.hoursToHalf).toBeCloseTo(0.5 * 20 * (60 / 600) ** 1.25, 9);
    expect(row.message).toMatch(/running down.*about 34 min/);
    // At idle a 50 A alternator gives 60 % (common practice default): 30 A, 50 A short of the 80 A of loads.
    expect(row.idleA).toBeCloseTo(30, 9);
    expect(row.message).toMatch(/At idle it gives only about 30 A \(60 % of its rating\), 50\.0 A short/);
  });

  it("without an alternator the battery carries everything", () => {
    // Arithmetic (Peukert, k = 1.25, 20-hour rate): a 20 A load on a 90 Ah battery empties in 20 x (90 / 400)^1.25 =
    // 3.09 h and reaches half in 1.55 h.
    const doc = truck({ alternator: false, capacityAh: 90 });
    doc.components.push({ id: "L1", kind: "load", position: { x: 300, y: -200 }, mode: "current", value: 20, enabled: true });
    doc.wires.push({ id: "W5", from: "N1.t", to: "L1.pos", resistanceOhm: 0 }, { id: "W6", from: "L1.neg", to: "G1.t", resistanceOhm: 0 });
    doc.states = [];
    const [row] = supplyCheck(doc);
    expect(row.verdict).toBe("battery-only");
    expect(row.hoursToHalf).toBeCloseTo(0.5 * 20 * (90 / 400) ** 1.25, 9);
    // A battery given an exponent of 1 (an ideal one) gives the plain 0.5 x 90 / 20 = 2.25 h.
    (doc.components.find((c) => c.kind === "battery") as { peukertExponent?: number }).peukertExponent = 1;
    expect(supplyCheck(doc)[0].hoursToHalf).toBeCloseTo(2.25, 9);
  });
});
