import { describe, expect, it } from "vitest";
import { diffDocuments, probeIssues, terminalsOf } from "@/lib/circuit";
import { pickupCharging } from "@/db/demo-work";

describe("diffDocuments", () => {
  it("names the parts added, removed and changed, and ignores key order", () => {
    const reverseKeys = (v: unknown): unknown =>
      Array.isArray(v) ? v.map(reverseKeys) : v && typeof v === "object" ? Object.fromEntries(Object.entries(v).reverse().map(([k, x]) => [k, reverseKeys(x)])) : v;
    const reordered = reverseKeys(pickupCharging) as typeof pickupCharging;
    expect(diffDocuments(pickupCharging, reordered).same).toBe(true);
    const edited = {
      ...pickupCharging,
      name: "Charging circuit, bracket cleaned",
      components: [...pickupCharging.components.filter((c) => c.id !== "L1").map((c) => (c.id === "JAC" ? { ...c, resistance: 0.0004 } : c)), { id: "GX", kind: "ground" as const }],
      wires: pickupCharging.wires.slice(1),
    };
    const d = diffDocuments(pickupCharging, edited);
    expect(d.same).toBe(false);
    expect(d.fields).toEqual([{ field: "name", from: "Charging circuit", to: "Charging circuit, bracket cleaned" }]);
    expect(d.components).toEqual({ added: ["GX"], removed: ["L1"], changed: ["JAC"] });
    expect(d.wires).toEqual({ added: [], removed: ["W0"], changed: [] });
  });
});

describe("probe checks", () => {
  it("lists every terminal and refuses probes the circuit lacks", () => {
    expect(terminalsOf(pickupCharging).slice(0, 4)).toEqual(["B1.pos", "B1.neg", "JBP.a", "JBP.b"]);
    expect(probeIssues(pickupCharging, { positive: "B1.pos", negative: "B1.neg", stateId: "charge" })).toEqual([]);
    expect(probeIssues(pickupCharging, { positive: "B1.pos", negative: "B1.pos", stateId: "crank" }).map((i) => i.path)).toEqual(["negative", "stateId"]);
  });
});
