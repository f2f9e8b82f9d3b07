import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { fromSI, parseDecimal, parseQuantity, toSI, typedNumber, type Quantity } from "@/lib/units";

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

describe("numbers as people type them", () => {
  it("reads a decimal comma as a decimal mark, never as grouping", () => {
    // Regression: "1,5 m" typed in the workspace was saved as 15 m.
    expect(parseQuantity("1,5 m", "length")).toEqual({ ok: true, value: 1.5 });
    expect(parseQuantity("12,45 V", "voltage")).toEqual({ ok: true, value: 12.45 });
    expect(parseQuantity("0,125 ohm", "resistance")).toEqual({ ok: true, value: 0.125 });
    expect(parseQuantity(",5", "length")).toEqual({ ok: true, value: 0.5 });
    expect(parseDecimal("-0,25")).toEqual({ ok: true, value: -0.25 });
    expect(parseDecimal("\u22123.5")).toEqual({ ok: true, value: -3.5 });
    expect(parseDecimal("1e3")).toEqual({ ok: true, value: 1000 });
  });

  it("asks about a comma that could be either mark, and refuses grouped digits", () => {
    const r = parseQuantity("1,500 W", "power");
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(/could be 1\.5 or 1500/);
    for (const t of ["1,500.5", "1.500,5", "1 500", "12,345,678"]) {
      const p = parseDecimal(t);
      expect(p.ok, t).toBe(false);
    }
    expect(parseDecimal("abc").ok).toBe(false);
    expect(parseDecimal("1.2.3").ok).toBe(false);
  });

  it("reads feet and inches together", () => {
    // 1 ft = 0.3048 m and 1 in = 0.0254 m exactly (international yard and pound, 1959).
    const five6 = 5 * 0.3048 + 6 * 0.0254;
    for (const t of ["5 ft 6 in", "5ft6in", "5' 6\"", "5 feet 6 inches"]) {
      const r = parseQuantity(t, "length");
      expect(r.ok, t).toBe(true);
      expect(r.ok && r.value, t).toBeCloseTo(five6, 12);
    }
    const c = parseQuantity("4 ft 7,5 in", "length");
    expect(c.ok && c.value).toBeCloseTo(4 * 0.3048 + 7.5 * 0.0254, 12);
  });

  it("reads every unit the forms offer", () => {
    // Definitions: SI prefixes; 1 in = 25.4 mm; 1 h = 3600 s; 1 kW = 1000 W.
    const cases: [string, Quantity, number][] = [
      ["48 in", "length", 1.2192],
      ["350 mm", "length", 0.35],
      ["2,5 cm", "length", 0.025],
      ["300 A", "current", 300],
      ["450 mA", "current", 0.45],
      ["1,5 kW", "power", 1500],
      ["1500 W", "power", 1500],
      ["120 mV", "voltage", 0.12],
      ["0,4 mOhm", "resistance", 0.0004],
      ["2 h", "time", 7200],
      ["90 s", "time", 90],
      ["-20 C", "temperature", -20],
    ];
    for (const [t, q, want] of cases) {
      const r = parseQuantity(t, q);
      expect(r.ok, t).toBe(true);
      expect(r.ok && r.value, t).toBeCloseTo(want, 10);
    }
  });

  it("typedNumber turns form text into numbers and refuses in words", () => {
    const schema = typedNumber(z.number().min(0));
    expect(schema.parse("12,6")).toBe(12.6);
    expect(schema.parse(3)).toBe(3);
    const bad = schema.safeParse("1,500");
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].message).toMatch(/could be 1\.5 or 1500/);
  });
});
