import { describe, expect, it } from "vitest";
import {
  AWG_SIZES,
  METRIC_SIZES,
  ambientFactor,
  bundleFactor,
  deratedAmpacity,
  findSize,
  resistancePerMetre,
  sizeCable,
  squareRootRule,
  tableAmpacity,
  temperatureFactor,
  type ConductorSize,
} from "@/lib/conductors";
import refs from "../../fixtures/conductor-references.json";

const size = (label: string) => findSize(label) as ConductorSize;
const FT = 0.3048;

describe("resistance at 20 C", () => {
  it.each(Object.entries(refs.awgSolidCopperOhmPer1000ft.values))(
    "%s solid copper matches the NBS Handbook 100 table within 0.1 %",
    (label, ohmPer1000ft) => {
      // Source: NBS Handbook 100, Copper Wire Tables (see fixture), before the stranding factor.
      const ours = resistancePerMetre(size(label), "copper", 20, false) * 1000 * FT;
      expect(Math.abs(ours / ohmPer1000ft - 1)).toBeLessThan(0.001);
    },
  );

  it.each(Object.entries(refs.iec60228Class5MaxOhmPerKm.values))(
    "%s stranded copper is at or under the IEC 60228 class 5 maximum, by 5 to 13 %",
    (label, maxOhmPerKm) => {
      // Source: IEC 60228 class 5 maxima. Nominal area x resistivity x 1.02 lands 7.6 % (70 mm2) to 11.9 %
      // (2.5 mm2) under the maximum, because the standard's maxima allow for real strands being under nominal.
      const ours = resistancePerMetre(size(label), "copper", 20) * 1000;
      expect(ours).toBeLessThanOrEqual(maxOhmPerKm);
      const under = 1 - ours / maxOhmPerKm;
      expect(under).toBeGreaterThan(0.05);
      expect(under).toBeLessThan(0.13);
    },
  );

  it("offers every AWG and metric size of the document format, in increasing area", () => {
    expect(AWG_SIZES.map((s) => s.label)).toEqual(["20 AWG", "18 AWG", "16 AWG", "14 AWG", "12 AWG", "10 AWG", "8 AWG", "6 AWG", "4 AWG", "2 AWG", "1 AWG", "1/0 AWG", "2/0 AWG", "3/0 AWG", "4/0 AWG"]);
    expect(METRIC_SIZES).toHaveLength(15);
    for (const list of [AWG_SIZES, METRIC_SIZES]) for (let i = 1; i < list.length; i++) expect(list[i].areaM2).toBeGreaterThan(list[i - 1].areaM2);
    // ASTM B258: 4/0 AWG is 0.4600 in across.
    expect(Math.sqrt((4 * size("4/0 AWG").areaM2) / Math.PI) / 0.0254).toBeCloseTo(0.46, 4);
  });

  it("reads the ways people write sizes", () => {
    expect(findSize("2/0 awg")?.label).toBe("2/0 AWG");
    expect(findSize("00 AWG")?.label).toBe("2/0 AWG");
    expect(findSize("16mm2")?.label).toBe("16 mm2");
    expect(findSize("16 mm²")?.label).toBe("16 mm2");
    expect(findSize("7 AWG")).toBeUndefined();
    expect(findSize("3 mm2")).toBeUndefined();
  });
});

describe("temperature correction", () => {
  it.each(Object.entries(refs.copperTemperatureFactor.values))("copper at %s C has factor %s", (t, factor) => {
    // Source: IEC 60028 alpha form, factors from shared REFERENCES.
    expect(temperatureFactor("copper", Number(t))).toBeCloseTo(factor, 4);
  });
});

describe("ampacity, 33 CFR 183.425 Table 5", () => {
  for (const table of [refs.table5, refs.table5FromMemory]) {
    it.each(Object.entries(table.rows))(`%s matches the table (${table.source})`, (label, row) => {
      table.columns.forEach((col, i) => {
        const a = tableAmpacity(size(label), col);
        expect(a?.amps).toBe(row[i]);
        expect(a?.derived).toBe(false);
      });
    });
  }

  it("takes the lower column for a rating between columns", () => {
    // 33 CFR 183.425 Table 5, 6 AWG: 100 A at 90 C (between 90 and 105: the lower column).
    const a = tableAmpacity(size("6 AWG"), 100);
    expect(a).toMatchObject({ amps: 100, columnC: 90, lowerColumn: true });
    expect(tableAmpacity(size("6 AWG"), 55)).toBeUndefined();
  });

  it("derives sizes the table does not list by log-log interpolation in circular mils, marked derived", () => {
    const a = tableAmpacity(size("25 mm2"), 105);
    // 25 mm2 = 49,340 cmil lies between 4 AWG (41,740 cmil, 160 A) and 2 AWG (66,360 cmil, 210 A) in Table 5.
    const t = (Math.log(49340) - Math.log(41740)) / (Math.log(66360) - Math.log(41740));
    const expected = Math.exp(Math.log(160) + t * (Math.log(210) - Math.log(160)));
    expect(a?.derived).toBe(true);
    expect(a?.amps).toBeCloseTo(expected, 0);
    expect(a!.amps).toBeGreaterThan(160);
    expect(a!.amps).toBeLessThan(210);
  });
});

describe("derating", () => {
  it.each(refs.necAmbientFactors.bands)("NFPA 70 ambient factor for $ratingC C insulation at $topC C is $factor", ({ ratingC, topC, factor }) => {
    // Each printed factor equals the square-root formula at the top of its band, rounded to two places
    // (NFPA 70 310.15(B)(1); sourced rows flagged in the fixture, others from memory).
    expect(Math.round(squareRootRule(ratingC, topC) * 100) / 100).toBe(factor);
    // Ampwright applies it only downward: Table 5 (30 C basis) prints nothing for colder ambients.
    expect(ambientFactor(ratingC, topC)).toBeCloseTo(Math.min(1, factor), 1);
  });

  it("takes no credit for the cold: at -20 C a 10 AWG cable keeps its table rating, and its fuse stays within it", () => {
    // Regression: at -20 C the factor rose above 1 and 10 AWG (Table 5: 60 A at 105 C) was allowed a 70 A fuse.
    expect(ambientFactor(105, -20)).toBe(1);
    const d = deratedAmpacity(size("10 AWG"), 105, -20, 1)!;
    expect(d.ampacityA).toBe(60); // 33 CFR 183.425 Table 5, 10 AWG, 105 C column
    const a = sizeCable({ systemVoltage: 12, currentA: 48, lengthM: 0.5, ambientC: -20, minSize: "10 AWG" });
    expect(a.recommended?.size).toBe("10 AWG");
    expect(a.protection!.ratingA).toBeLessThanOrEqual(60);
  });

  it.each(Object.entries(refs.engineRoomFactors.values))("engine compartment (50 C) factor for %s C insulation is %s", (rating, factor) => {
    // Source: shared REFERENCES, square-root rule from 30 to 50 C.
    expect(ambientFactor(Number(rating), 50)).toBeCloseTo(factor, 3);
  });

  it.each(refs.bundling.values)("%s conductors in a bundle: factor %s", (n, factor) => {
    // Source: USCG compliance guideline factors for 3+; 1 and 2 conductors unreduced (common practice).
    expect(bundleFactor(n)).toBe(factor);
  });

  it("reports the table value, both factors and the result", () => {
    // 33 CFR 183.425 Table 5: 8 AWG at 105 C = 80 A; 50 C ambient: sqrt(55/75) = 0.8563; 4 conductors: 0.60.
    const d = deratedAmpacity(size("8 AWG"), 105, 50, 4)!;
    expect(d.amps).toBe(80);
    expect(d.ambientFactor).toBeCloseTo(Math.sqrt(55 / 75), 12);
    expect(d.bundleFactor).toBe(0.6);
    expect(d.ampacityA).toBeCloseTo(80 * Math.sqrt(55 / 75) * 0.6, 9);
  });
});
