import { describe, expect, it } from "vitest";
import { pickupCharging } from "@/db/demo-work";
import { implausibleReading } from "@/lib/diagnosis/plausibility";

const r = (positive: string, negative: string, value: number, unit: "V" | "mV" = "V", stateId = "base") => ({ positive, negative, value, unit, stateId });

describe("readings that cannot be what the meter showed", () => {
  it("refuses 520 V at rest on a 12 V battery, and suggests millivolts", () => {
    // Regression: 520 V at rest was judged "about 100 % charged". 1.35 x 12 V = 16.2 V is the most a 12 V system shows.
    const out = implausibleReading(pickupCharging, r("B1.pos", "B1.neg", 520));
    expect(out).toHaveLength(1);
    expect(out[0]).toMatchObject({ likely: "mV typed as V" });
    expect(out[0].message).toMatch(/520 V is more than a 12 V system can show.*Was it 520 mV/);
  });

  it("refuses a negative voltage across a battery's own posts as swapped leads", () => {
    const [x] = implausibleReading(pickupCharging, r("B1.pos", "B1.neg", -12.6));
    expect(x.likely).toBe("leads swapped");
    expect(x.message).toMatch(/Record it as 12\.6 V/);
  });

  it("refuses a rest voltage a battery alone cannot make", () => {
    // A full 12 V lead-acid battery rests at about 12.7 V (BCI table: 12.65 V is 100 %); 14.1 V is charging.
    expect(implausibleReading(pickupCharging, r("B1.pos", "B1.neg", 14.1))[0].likely).toBe("not at rest");
    expect(implausibleReading(pickupCharging, r("B1.pos", "B1.neg", 14.1, "V", "charge"))).toEqual([]);
  });

  it("accepts ordinary readings, millivolts included", () => {
    expect(implausibleReading(pickupCharging, r("B1.pos", "B1.neg", 12.45))).toEqual([]);
    expect(implausibleReading(pickupCharging, r("B1.neg", "A1.case", 620, "mV", "charge"))).toEqual([]);
    expect(implausibleReading(pickupCharging, r("A1.out", "B1.pos", 0.3, "V", "charge"))).toEqual([]);
  });
});
