import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/v1/cable-size/route";

const post = (body: unknown) =>
  POST(new Request("http://test/api/v1/cable-size", { method: "POST", body: typeof body === "string" ? body : JSON.stringify(body), headers: { "content-type": "application/json" } }));

describe("POST /api/v1/cable-size", () => {
  it("answers the contract's shape", async () => {
    const res = await post({ systemVoltage: 12, currentA: 20, lengthM: 6 });
    expect(res.status).toBe(200);
    const a = await res.json();
    expect(a.status).toBe("ok");
    expect(Object.keys(a).sort()).toEqual(["ampacityBasis", "basis", "candidates", "closest", "limitV", "load", "notes", "protection", "reason", "recommended", "status", "temperatureBasis"]);
    expect(a.limitV).toBeCloseTo(0.36, 12); // 3 % of 12 V: ABYC E-11 critical-circuit limit
    expect(Object.keys(a.recommended).sort()).toEqual(["ambientFactor", "bundleFactor", "conductorTempC", "derived", "dropPercent", "dropV", "governing", "lossW", "materialFactor", "ok", "resistanceOhm", "size", "tableAmpacityA"].concat("ampacityA").sort());
    expect(Object.keys(a.protection.checks).sort()).toEqual(["ampacityA", "fault", "inrush", "peak", "ratingA"]);
  });

  it.each([
    [{ systemVoltage: 12, currentA: -5, lengthM: 6 }, "currentA"],
    [{ systemVoltage: 12, currentA: 5, lengthM: 0 }, "lengthM"],
    [{ systemVoltage: 12, currentA: 5, lengthM: 3, material: "silver" }, "material"],
    [{ systemVoltage: 12, currentA: 5, lengthM: 3, minSize: "7 AWG" }, "minSize"],
    [{ systemVoltage: 12, currentA: 5, lengthM: 3, maxDropV: 0.5, maxDropPercent: 3 }, "maxDropV"],
    [{ systemVoltage: 12, currentA: 5, lengthM: 3, colour: "red" }, "(body)"],
  ])("refuses %j with 422 naming %s", async (body, path) => {
    const res = await post(body);
    expect(res.status).toBe(422);
    const e = await res.json();
    expect(e.error.code).toBe("invalid-request");
    expect(e.error.issues.map((i: { path: string }) => i.path)).toContain(path);
  });

  it("answers 400 for a body that is not JSON", async () => {
    const res = await post("{not json");
    expect(res.status).toBe(400);
  });

  it("never answers 500 or NaN for random bodies", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.record({ systemVoltage: fc.oneof(fc.double(), fc.integer()), currentA: fc.oneof(fc.double(), fc.string()), lengthM: fc.double(), bundleSize: fc.integer({ min: -3, max: 400 }), conductorTemp: fc.oneof(fc.constant("rated"), fc.double()) }, { requiredKeys: [] }),
        async (body) => {
          const res = await post(body);
          expect([200, 422]).toContain(res.status);
          expect(await res.text()).not.toMatch(/NaN|Infinity/);
        },
      ),
      { numRuns: 200 },
    );
  });
});
