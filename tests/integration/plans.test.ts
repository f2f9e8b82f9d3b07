import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as planRoute from "@/app/api/v1/organizations/[orgId]/plans/[planId]/route";
import * as plansRoute from "@/app/api/v1/organizations/[orgId]/plans/route";
import { DEMO_PASSWORD, demoClass, demoShop } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { BUILT_IN_PLANS, type Plan } from "@/lib/diagnosis/plans";
import { callRoute, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
let lead = "";
let tech = "";
let outsider = "";
const params = { orgId: demoShop.id };

/** A shop's own plan: the built-in charging plan cut to its two drop checks, with a stricter limit's words. */
const ownPlan: Plan = {
  ...BUILT_IN_PLANS[0]!,
  id: "fleet-drops-test",
  name: "Fleet: charging drops only",
  steps: BUILT_IN_PLANS[0]!.steps.filter((s) => s.id === "positive" || s.id === "ground"),
};
const add = (plan: unknown, cookie = lead) => callRoute(h(plansRoute.POST), { json: { plan }, params, cookie });

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  lead = await signInCookie("tobias@larkspur.example", DEMO_PASSWORD);
  tech = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  outsider = await signInCookie("lena@fernmoor.example", DEMO_PASSWORD);
});
afterAll(async () => {
  await pool.query("delete from organization_plans where plan_key = 'fleet-drops-test'");
  await pool.end();
});

describe("an organisation's own test plans", () => {
  let id = "";
  it("adds a plan a lead wrote, which every member then lists beside the built-in ones", async () => {
    const res = await add(ownPlan);
    expect(res.status).toBe(201);
    id = (await res.json()).plan.id;
    const list = await (await callRoute(h(plansRoute.GET), { params, cookie: tech })).json();
    expect(list.builtIn.map((p: Plan) => p.id)).toEqual(["charging", "starting"]);
    expect(list.own).toEqual(expect.arrayContaining([expect.objectContaining({ id, plan: ownPlan }), expect.objectContaining({ id: "pln_demo_fleet_drops" })]));
    const other = await (await callRoute(h(plansRoute.GET), { params: { orgId: demoClass.id }, cookie: outsider })).json();
    expect(other.own).toEqual([]);
  });

  it("names each problem of a plan by its place, and refuses a second plan with the same id or a built-in id", async () => {
    const broken = { ...ownPlan, id: "Fleet Drops", steps: [{ ...ownPlan.steps[0], rule: { kind: "drop-below" } }] };
    const res = await add(broken);
    expect(res.status).toBe(422);
    const paths = (await res.json()).error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["plan.id", "plan.steps.0.rule.kind"]));
    expect((await add(ownPlan)).status).toBe(409);
    const builtIn = await add({ ...ownPlan, id: "charging" });
    expect(builtIn.status).toBe(422);
    expect(JSON.stringify(await builtIn.json())).toContain("built-in");
    expect((await add({ ...ownPlan, id: "tech-plan" }, tech)).status).toBe(403);
  });

  it("removes a plan for an owner or lead; it is then gone", async () => {
    expect((await callRoute(h(planRoute.DELETE), { method: "DELETE", params: { ...params, planId: id }, cookie: tech })).status).toBe(403);
    expect((await callRoute(h(planRoute.DELETE), { method: "DELETE", params: { ...params, planId: id }, cookie: lead })).status).toBe(204);
    expect((await callRoute(h(planRoute.DELETE), { method: "DELETE", params: { ...params, planId: id }, cookie: lead })).status).toBe(404);
  });
});

describe("verdicts as data", () => {
  it("gives a plan's checks and verdict, and the diagnosis, for a circuit the caller may read, and 404 to an outsider", async () => {
    const verdictRoute = await import("@/app/api/v1/circuits/[circuitId]/plans/[planId]/verdict/route");
    const diagnosisRoute = await import("@/app/api/v1/circuits/[circuitId]/diagnosis/route");
    // The demo's unit 27 has only its rest reading: 12.58 V is over BCI's 12.45 V (75 %), so the first check is good
    // and the rest are still to read.
    const res = await callRoute(h(verdictRoute.GET), { params: { circuitId: "cir_demo_unit27_charging", planId: "charging" }, cookie: tech });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.plan).toMatchObject({ id: "charging" });
    expect(body.steps[0]).toMatchObject({ id: "rest", status: "good" });
    expect(body.steps.slice(1).every((s: { status: string }) => s.status === "not-read")).toBe(true);
    expect(body.verdict.kind).toBe("incomplete");
    expect((await callRoute(h(verdictRoute.GET), { params: { circuitId: "cir_demo_unit27_charging", planId: "nope" }, cookie: tech })).status).toBe(404);
    expect((await callRoute(h(verdictRoute.GET), { params: { circuitId: "cir_demo_unit27_charging", planId: "charging" }, cookie: outsider })).status).toBe(404);

    // Unit 14: its readings put the extra resistance in the alternator's mounting bracket (the demo's story).
    const d = await (await callRoute(h(diagnosisRoute.GET), { params: { circuitId: "cir_demo_unit14_charging" }, cookie: tech })).json();
    expect(d.readings.length).toBeGreaterThan(2);
    expect(d.readings.every((r: { verdict: string }) => ["as-predicted", "higher", "lower", "no-model"].includes(r.verdict))).toBe(true);
    expect(d.location.suspects.length).toBeGreaterThanOrEqual(0);
    expect(typeof d.location.residualV).toBe("number");
  });
});
