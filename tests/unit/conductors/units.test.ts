import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { fromSI, parseQuantity, toSI, type Quantity } from "@/lib/units";

describe("units at the edge", () => {
  it("reads what people type", () => {
    // Definitions: 1 ft = 0.3048 m exactly; 1 cmil = pi/4 mil^2 = 5.0670748e-10 m^2; F to C by (F - 32) x 5/9.
    expect(parseQuantity("18 ft", "length")).toEqual({ ok: true, value: 18 * 0.3048 });
    expect(parseQuantity("5 mOhm", "resistance")).toMatchObject({ ok: true, value: 0.005 });
    expect(parseQuantity("45 C", "temperature")).toMatchObject({ ok: true, value: 45 });
    const f = parseQuantity("110 F", "temperature");
    expect(f.ok && f.value).toBeCloseTo(((110 - 32) * 5) / 9, 12);
    expect(parseQuantity("10 min", "time")).toMatchObject({ ok: true, value: 600 });
    const cm = parseQuantity("66360 cmil", "area");
    expect(cm.ok && Math.abs(cm.value / (66360 * 5.0670748e-10) - 1)).toBeLessThan(1e-7);
    expect(parseQuantity("2.5", "length")).toMatchObject({ ok: true, value: 2.5 });
  });

  it("says what to fix for a wrong unit or an empty field", () => {
    const bad = parseQuantity("3 furlongs", "current");
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.message).toMatch(/not a current.*120 A/);
    expect(parseQuantity("12 V", "length").ok).toBe(false);
    expect(parseQuantity("", "length").ok).toBe(false);
  });

  it("converts to SI and back within 1e-12 relative plus 1e-12 absolute", () => {
    const units: [Quantity, string][] = [["length", "ft"], ["length", "in"], ["length", "mm"], ["current", "mA"], ["temperature", "degF"], ["area", "cmil"], ["area", "kcmil"], ["area", "mm^2"], ["resistance", "mohm"], ["time", "minute"]];
    fc.assert(
      fc.property(fc.constantFrom(...units), fc.double({ min: -1e6, max: 1e6, noNaN: true }), ([q, u], x) => {
        const back = fromSI(toSI(x, q, u), q, u);
        expect(Math.abs(back - x)).toBeLessThanOrEqual(1e-12 * Math.abs(x) + 1e-12);
      }),
      { numRuns: 500 },
    );
  });
});
