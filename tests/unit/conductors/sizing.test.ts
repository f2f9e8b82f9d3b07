import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { AWG_SIZES, dropAtLength, longestRun, STRANDING_FACTOR, sizeCable, type SizingRequest } from "@/lib/conductors";

const FT = 0.3048;

describe("sizeCable against the marine circular-mil formula", () => {
  // ABYC E-11 (marine standard): CM = K I L / E, K = 10.75 ohm-cmil/ft, L the round-trip length in feet, then
  // the next larger size. NBS Handbook 100: solid copper is 10.371 ohm-cmil/ft at 20 C. Our conductor is
  // stranded (x 1.02), so K = 10.75 corresponds to 10.371 x 1.02 x (1 + 0.00393 (T - 20)) = 10.75, i.e.
  // T = 20 + (10.75 / (10.371 x 1.02) - 1) / 0.00393 = 24.13 C. The cases run at that temperature.
  const K = 10.75;
  const equivalentC = 20 + (K / (10.371 * STRANDING_FACTOR) - 1) / 0.00393;

  it("uses an equivalent temperature of about 24.13 C", () => {
    expect(equivalentC).toBeCloseTo(24.13, 2);
  });

  it("picks the size the formula picks, on 300 random voltage-drop-limited cases", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 150, noNaN: true }),
        fc.double({ min: 1, max: 12, noNaN: true }),
        fc.constantFrom(3, 10),
        (currentA, lengthM, percent) => {
          const E = (percent / 100) * 12;
          const cm = (K * currentA * 2 * (lengthM / FT)) / E;
          const byFormula = AWG_SIZES.find((s) => s.cmil >= cm);
          // Skip cases within 0.05 % of a size boundary: the published 10.371 is itself rounded.
          if (AWG_SIZES.some((s) => Math.abs(s.cmil / cm - 1) < 5e-4)) return;
          const answer = sizeCable({ systemVoltage: 12, currentA, lengthM, maxDropPercent: percent, conductorTemp: equivalentC, insulationRatingC: 200, minSize: "20 AWG" });
          const firstByDrop = answer.candidates.find((c) => c.dropV <= E);
          expect(firstByDrop?.size).toBe(byFormula?.label);
        },
      ),
      { numRuns: 300, seed: 42 },
    );
  });
});

describe("sizeCable, cases worked by hand", () => {
  it("a 20 A light bar 6 m from the battery: drop decides, 6 AWG on a 25 A fuse", () => {
    // Critical circuit, 3 % of 12 V = 0.36 V (ABYC E-11). Round trip 12 m at 30 C (no zone given: table basis).
    // 8 AWG: 0.6282 ohm/kft (NBS) / 304.8 x 1.02 x 1.0393 = 2.185 mOhm/m -> 20 A x 12 m x 2.185 m = 0.524 V (too much).
    // 6 AWG: 0.3951 / 304.8 x 1.02 x 1.0393 = 1.374 mOhm/m -> 0.330 V (fits).
    // Fuse: 125 % of 20 A = 25 A, a blade fuse (ISO 8820 series); 6 AWG at 105 C carries 120 A (Table 5).
    const a = sizeCable({ systemVoltage: 12, currentA: 20, lengthM: 6, conductorTemp: "ambient" });
    expect(a.status).toBe("ok");
    expect(a.recommended?.size).toBe("6 AWG");
    expect(a.recommended?.governing).toBe("drop");
    expect(a.recommended?.dropV).toBeCloseTo(0.3298, 3);
    expect(a.candidates.find((c) => c.size === "8 AWG")?.dropV).toBeCloseTo(0.5244, 3);
    expect(a.protection).toMatchObject({ ratingA: 25, type: "blade" });
    expect(a.protection?.placement).toMatch(/7 in.*183\.455/);
  });

  it("a 140 A continuous feed 0.5 m long: protection decides, so a 175 A fuse protects the cable", () => {
    // 125 % of 140 A = 175 A, a bolt-in fuse. Cabin, 30 C: 4 AWG at 105 C carries 160 A (Table 5): enough for
    // 140 A but not for a 175 A fuse; 2 AWG carries 210 A. Drop on 2 AWG: 140 A x 1 m x 0.544 mOhm/m = 0.076 V.
    const a = sizeCable({ systemVoltage: 12, currentA: 140, lengthM: 0.5, zone: "cabin" });
    expect(a.candidates.find((c) => c.size === "4 AWG")?.governing).toBe("protection");
    expect(a.recommended?.size).toBe("2 AWG");
    expect(a.recommended?.governing).toBe("protection");
    expect(a.protection).toMatchObject({ ratingA: 175, type: "bolt-in" });
  });

  it("a winch on intermittent duty: heat at the duty-cycle equivalent, drop at the peak, a device that carries the peak", () => {
    // 300 A peak, 1 minute in 10: equivalent 300 x sqrt(60/600) = 94.9 A (common practice). Non-critical 10 %:
    // 1.2 V over a 2 x 2.5 m round trip at 50 C engine-bay ambient (zone default), insulation 105 C.
    // The device must carry 300 A for 60 s. Representative bolt-in band (lib/conductors/devices.ts, from memory):
    // at 150 % it may open no sooner than 60 s, so 300 A / 1.5 = 200 A is the smallest bolt-in rating that holds.
    // Regression: the duty-equivalent current used to size the device (a 125 A fuse, which would open in seconds).
    // The cable must carry 200 A after derating: sqrt((105 - 50) / (105 - 30)) = 0.8563 (NFPA 70 310.15(B)(1)):
    // 2 AWG 210 x 0.8563 = 179.8 A (too little), 1 AWG 245 x 0.8563 = 209.8 A (33 CFR 183.425 Table 5).
    // Drop on 1 AWG at its operating temperature 50 + 55 x (94.9 / 209.8)^2 = 61.25 C:
    // 0.1239 ohm/kft (NBS Handbook 100) / 304.8 x 1.02 x (1 + 0.00393 x 41.25) = 0.4819 mOhm/m x 5 m x 300 A = 0.723 V.
    const a = sizeCable({ systemVoltage: 12, currentA: 300, lengthM: 2.5, circuitClass: "non-critical", zone: "engine", duty: { kind: "intermittent", onS: 60, periodS: 600 } });
    expect(a.recommended?.size).toBe("1 AWG");
    expect(a.recommended?.governing).toBe("protection");
    expect(a.recommended?.ampacityA).toBeCloseTo(209.8, 1);
    expect(a.recommended?.conductorTempC).toBeCloseTo(61.25, 1);
    expect(a.recommended?.dropV).toBeCloseTo(0.723, 2);
    expect(a.protection).toMatchObject({ ratingA: 200, family: "bolt-in" });
    expect(a.protection!.checks.peak.opensNoSoonerThanS).toBeGreaterThanOrEqual(60 - 1e-9);
    expect(a.notes.join(" ")).toMatch(/94\.9 A/);
  });

  it("chassis return adds the frame's resistance to one conductor length", () => {
    // One-way 4 m of 10 AWG at 30 C: 0.9989 / 304.8 x 1.02 x 1.0393 = 3.474 mOhm/m x 4 m = 13.9 mOhm, + 10 mOhm frame.
    const a = sizeCable({ systemVoltage: 12, currentA: 10, lengthM: 4, returnPath: "chassis", returnResistanceOhm: 0.01, minSize: "10 AWG", conductorTemp: "ambient" });
    const c = a.candidates.find((x) => x.size === "10 AWG")!;
    expect(c.resistanceOhm).toBeCloseTo(0.0139 + 0.01, 4);
    expect(c.dropV).toBeCloseTo(10 * (0.0139 + 0.01), 3);
  });

  it("says why when no size fits, and offers the closest", () => {
    const a = sizeCable({ systemVoltage: 12, currentA: 400, lengthM: 9 });
    expect(a.status).toBe("no-size-fits");
    expect(a.recommended).toBeNull();
    expect(a.closest?.size).toBe("4/0 AWG");
    expect(a.reason).toMatch(/4\/0 AWG drops .* V against a limit of 0\.36 V/);
  });

  it("honours the minimum size and the metric family", () => {
    const small = sizeCable({ systemVoltage: 12, currentA: 1, lengthM: 1 });
    expect(small.recommended?.size).toBe("18 AWG");
    expect(small.recommended?.governing).toBe("minimum-size");
    const metric = sizeCable({ systemVoltage: 24, currentA: 30, lengthM: 5, family: "metric" });
    expect(metric.recommended?.size).toMatch(/ mm2$/);
  });
});

const request = fc.record({
  systemVoltage: fc.constantFrom(12, 24),
  currentA: fc.double({ min: 0.5, max: 400, noNaN: true }),
  lengthM: fc.double({ min: 0.2, max: 15, noNaN: true }),
  ambientC: fc.integer({ min: -20, max: 70 }),
  insulationRatingC: fc.constantFrom(60, 80, 90, 105, 125),
  bundleSize: fc.integer({ min: 1, max: 30 }),
  family: fc.constantFrom("awg" as const, "metric" as const),
  circuitClass: fc.constantFrom("critical" as const, "non-critical" as const),
});

const rankOf = (a: ReturnType<typeof sizeCable>) => (a.recommended ? a.candidates.findIndex((c) => c.size === a.recommended!.size) : Infinity);

describe("sizeCable properties", () => {
  it("a larger size never has more resistance or less ampacity", () => {
    fc.assert(
      fc.property(request, (r) => {
        const a = sizeCable(r);
        for (let i = 1; i < a.candidates.length; i++) {
          expect(a.candidates[i].resistanceOhm).toBeLessThanOrEqual(a.candidates[i - 1].resistanceOhm);
          expect(a.candidates[i].ampacityA).toBeGreaterThanOrEqual(a.candidates[i - 1].ampacityA);
        }
      }),
      { numRuns: 200 },
    );
  });

  it("more current, more length or a tighter limit never gives a smaller size", () => {
    fc.assert(
      fc.property(request, fc.double({ min: 1, max: 3, noNaN: true }), (r, k) => {
        const base = rankOf(sizeCable(r));
        expect(rankOf(sizeCable({ ...r, currentA: r.currentA! * k }))).toBeGreaterThanOrEqual(base);
        expect(rankOf(sizeCable({ ...r, lengthM: r.lengthM * k }))).toBeGreaterThanOrEqual(base);
        const limit = r.circuitClass === "critical" ? 3 : 10;
        expect(rankOf(sizeCable({ ...r, maxDropPercent: limit / k }))).toBeGreaterThanOrEqual(base);
      }),
      { numRuns: 200 },
    );
  });

  it("the recommendation satisfies every limit it reports, and nothing is NaN", () => {
    fc.assert(
      fc.property(request, (r: SizingRequest) => {
        const a = sizeCable(r);
        expect(JSON.stringify(a)).not.toMatch(/NaN|Infinity/);
        if (!a.recommended) return;
        const limitV = ((r.circuitClass === "critical" ? 3 : 10) / 100) * r.systemVoltage;
        expect(a.recommended.dropV).toBeLessThanOrEqual(limitV + 1e-12);
        expect(a.recommended.ampacityA).toBeGreaterThanOrEqual(r.currentA! - 1e-9);
        expect(a.protection!.ratingA).toBeGreaterThanOrEqual(1.25 * r.currentA! - 1e-9);
        expect(a.protection!.ratingA).toBeLessThanOrEqual(a.recommended.ampacityA + 1e-9);
      }),
      { numRuns: 300 },
    );
  });
});

describe("the drop-against-length curve", () => {
  it("redraws each candidate's drop at its own length, scales the cable part and keeps the chassis return", () => {
    fc.assert(
      fc.property(request, fc.double({ min: 0, max: 40, noNaN: true }), fc.double({ min: 0, max: 0.02, noNaN: true }), (r, length, returnR) => {
        const a = sizeCable({ ...r, returnPath: returnR > 0 ? "chassis" : "two-wire", returnResistanceOhm: returnR });
        for (const c of a.candidates) {
          // Arithmetic: at the request's own length the curve passes through the table's value.
          expect(dropAtLength(a, c, r.lengthM)).toBeCloseTo(c.dropV, 9);
          // Arithmetic: drop = I (R_return + r_cable L); at zero length only the return is left.
          expect(dropAtLength(a, c, 0)).toBeCloseTo(r.currentA * returnR, 9);
          const slope = (c.dropV - r.currentA * returnR) / r.lengthM;
          expect(dropAtLength(a, c, length)).toBeCloseTo(r.currentA * returnR + slope * length, 6);
        }
      }),
      { numRuns: 100 },
    );
  });

  it("the longest run of a candidate is where its drop meets the limit", () => {
    // Worked by hand: 20 A two-wire at 12 V, 3 % is 0.36 V. A candidate of 0.006 ohm over a 6 m run has
    // 0.001 ohm per metre of run (both conductors), so 20 A x 0.001 ohm/m x L = 0.36 V gives L = 18 m.
    const a = { basis: { currentA: 20, lengthM: 6, returnResistanceOhm: 0 }, limitV: 0.36 };
    expect(longestRun(a, { resistanceOhm: 0.006 })).toBeCloseTo(18, 9);
    // With a 9 mOhm chassis return, 20 A already drops 0.18 V there; 0.18 V / (20 A x 0.001 ohm/m) = 9 m.
    const chassis = { basis: { currentA: 20, lengthM: 6, returnResistanceOhm: 0.009 }, limitV: 0.36 };
    expect(longestRun(chassis, { resistanceOhm: 0.009 + 0.006 })).toBeCloseTo(9, 9);
    // A return that alone exceeds the limit leaves no length at all.
    expect(longestRun({ ...chassis, basis: { ...chassis.basis, returnResistanceOhm: 0.02 } }, { resistanceOhm: 0.026 })).toBe(0);
  });
});
