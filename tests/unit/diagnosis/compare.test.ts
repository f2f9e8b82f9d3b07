import { describe, expect, it } from "vitest";
import { pickupCharging } from "@/db/demo-work";
import { checkReadings, JOINT_HEAT_WARNING_W } from "@/lib/diagnosis/compare";
import { solveCircuit } from "@/lib/solver";

const withGoodBracket = { ...pickupCharging, components: pickupCharging.components.map((c) => (c.id === "JAC" ? { ...c, resistance: 0.0004 } : c)) };
const reading = (over: Partial<Parameters<typeof checkReadings>[1][number]>) => ({ id: "r", stateId: "charge", positive: "GE.t", negative: "A1.case", value: 0, unit: "V" as const, currentA: null, ...over });

describe("readings against the model", () => {
  it("predicts the same two points in the same state, and calls a close reading as predicted", () => {
    const model = solveCircuit(pickupCharging, { state: "charge" });
    const expected = model.terminals["GE.t"] - model.terminals["A1.case"];
    const [c] = checkReadings(pickupCharging, [reading({ value: expected * 1.05 })]);
    expect(c.expectedV).toBeCloseTo(expected, 12);
    // Within Ampwright's allowance of 10 % or 20 mV (no source).
    expect(c.verdict).toBe("as-predicted");
    expect(c.path?.ids).toEqual(["W5", "JAC", "W4"]);
  });

  it("finds the extra resistance a reading implies over a model with a good joint, and the heat it makes", () => {
    // Worked by hand: 1.68 V across block-to-case at 49 A on the clamp gives R = V / I = 1.68 / 49 = 34.29 mOhm
    // (Ohm's law). The model's path is the 0.4 mOhm bracket and two zero-ohm links, so the excess is 33.89 mOhm,
    // and it turns I^2 R = 49^2 x 0.03389 = 81.4 W into heat.
    const [c] = checkReadings(withGoodBracket, [reading({ value: 1.68, currentA: 49 })]);
    expect(c.verdict).toBe("higher");
    expect(c.path!.currentFrom).toBe("clamp");
    expect(c.path!.impliedOhm).toBeCloseTo(1.68 / 49, 12);
    expect(c.path!.expectedOhm).toBeCloseTo(0.0004, 12);
    expect(c.path!.excessOhm).toBeCloseTo(1.68 / 49 - 0.0004, 12);
    expect(c.path!.excessHeatW).toBeCloseTo(49 * 49 * (1.68 / 49 - 0.0004), 9);
    expect(c.path!.excessHeatW).toBeGreaterThan(JOINT_HEAT_WARNING_W);
    expect(c.path!.heatWarning).toMatch(/char insulation/);
  });

  it("uses the model's current without a clamp reading, and says so when a branch joins the path", () => {
    const [same] = checkReadings(withGoodBracket, [reading({ value: 20, unit: "mV" })]);
    expect(same.measuredV).toBeCloseTo(0.02, 12);
    expect(same.path?.currentFrom).toBe("model");
    // Battery - to the alternator case passes the engine block, where the body strap's return joins.
    const [branched] = checkReadings(pickupCharging, [reading({ positive: "B1.neg", negative: "A1.case", value: 1.69, currentA: 49 })]);
    expect(branched.path).toBeUndefined();
    expect(branched.pathNote).toMatch(/branch/);
  });

  it("explains a reading it cannot predict, and a reading across a source", () => {
    const [gone] = checkReadings(pickupCharging, [reading({ stateId: "crank", value: 1 })]);
    expect(gone.verdict).toBe("no-model");
    const [across] = checkReadings(pickupCharging, [reading({ positive: "B1.pos", negative: "B1.neg", stateId: "base", value: 12.44 })]);
    // At rest the battery shows its open-circuit voltage: the demo's 12.45 V.
    expect(across.expectedV).toBeCloseTo(12.45, 9);
    expect(across.verdict).toBe("as-predicted");
    expect(across.path).toBeUndefined();
  });
});

describe("battery readings", () => {
  it("reads a rested battery's state of charge from the BCI table, and a 24 V pair as two 12 V batteries", async () => {
    const { stateOfChargePercent } = await import("@/lib/diagnosis/limits");
    // Battery Council International table (flooded lead-acid 12 V, rested, about 27 C): 12.65 V 100 %, 12.45 V 75 %,
    // 12.24 V 50 %, 12.06 V 25 %, 11.89 V 0 %; between points by straight lines (Ampwright's reading of the table).
    expect(stateOfChargePercent(12.45, 12)).toBeCloseTo(75, 9);
    expect(stateOfChargePercent(12.24, 12)).toBeCloseTo(50, 9);
    expect(stateOfChargePercent(12.55, 12)).toBeCloseTo(87.5, 9);
    expect(stateOfChargePercent(11.5, 12)).toBe(0);
    expect(stateOfChargePercent(12.9, 12)).toBe(100);
    expect(stateOfChargePercent(24.9, 24)).toBeCloseTo(75, 9);
  });

  it("gives the state of charge at rest and the charging window while the alternator charges", () => {
    const [rest, charging] = checkReadings(pickupCharging, [
      reading({ id: "a", stateId: "base", positive: "B1.pos", negative: "B1.neg", value: 12.44 }),
      reading({ id: "b", stateId: "charge", positive: "B1.pos", negative: "B1.neg", value: 12.58 }),
    ]);
    // 12.44 V sits between BCI's 12.24 V (50 %) and 12.45 V (75 %): 50 + 25 x 0.20 / 0.21 = 73.8 %.
    expect(rest.battery).toEqual({ kind: "rest", socPercent: expect.closeTo(50 + (25 * 0.2) / 0.21, 6) });
    // Common practice: 13.5 to 14.8 V while charging a 12 V system at 25 C; the pickup's 30 C lowers the low end by
    // 3 mV per cell per degree (common practice, from memory): 13.5 - 0.003 x 6 x 5 = 13.41 V. 12.58 V is under it.
    expect(charging.battery).toEqual({ kind: "charging", window: [expect.closeTo(13.41, 9), 14.8], within: false, tempC: 30 });
  });
});
