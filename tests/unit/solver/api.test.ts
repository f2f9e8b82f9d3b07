import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/v1/solve/route";
import { circuit, randomLinearCircuit } from "../../support/circuits";

const post = (body: unknown, raw?: string) =>
  POST(new Request("http://test/api/v1/solve", { method: "POST", body: raw ?? JSON.stringify(body), headers: { "content-type": "application/json" } }));

const doc = circuit(
  [
    { id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.01 },
    { id: "L1", kind: "load", mode: "current", value: 10 },
  ],
  [
    { id: "W1", from: "B1.pos", to: "L1.pos", resistanceOhm: 0.01 },
    { id: "W2", from: "L1.neg", to: "B1.neg", resistanceOhm: 0.01 },
  ],
  { states: [{ id: "heavy", name: "Heavy", set: { L1: { value: 50 } } }] },
);

describe("POST /api/v1/solve", () => {
  it("answers the result contract for the base state and a named one", async () => {
    const res = await post({ circuit: doc });
    expect(res.status).toBe(200);
    const r = await res.json();
    expect(Object.keys(r)).toEqual(expect.arrayContaining(["status", "state", "converged", "iterations", "reference", "terminals", "components", "wires", "issues"]));
    expect(r.state).toBe("base");
    expect(r.wires.W1.drop).toBeCloseTo(0.1, 12); // 10 A x 0.01 ohm
    const heavy = await (await post({ circuit: doc, state: "heavy" })).json();
    expect(heavy.wires.W1.drop).toBeCloseTo(0.5, 12); // 50 A x 0.01 ohm
  });

  it("answers 422 with the zod issue paths for an invalid document", async () => {
    const bad = structuredClone(doc) as Record<string, unknown> & { components: Record<string, unknown>[] };
    bad.components[0].internalResistance = -1;
    bad.components[1].colour = "red";
    const res = await post({ circuit: bad });
    expect(res.status).toBe(422);
    const e = await res.json();
    const paths = e.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toContain("circuit.components.0.internalResistance");
    expect(paths).toContain("circuit.components.1");
  });

  it("answers 422 for an unknown document version", async () => {
    const res = await post({ circuit: { ...doc, schema: "ampwright.circuit/9" } });
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].path).toBe("circuit.schema");
  });

  it("answers 422 for more than 5,000 components", async () => {
    const big = randomLinearCircuit(3, 5001);
    const res = await post({ circuit: big });
    expect(res.status).toBe(422);
    expect((await res.json()).error.code).toBe("too-many-components");
  });

  it("answers 413 for a body over 4 MB", async () => {
    const res = await post(null, JSON.stringify({ circuit: doc, pad: "x".repeat(4 * 1024 * 1024 + 10) }));
    expect(res.status).toBe(413);
  });

  it("answers 400 for a body that is not JSON, never 500", async () => {
    expect((await post(null, "{")).status).toBe(400);
    expect((await post({ circuit: [] })).status).toBe(422);
    expect((await post({})).status).toBe(422);
  });
});
