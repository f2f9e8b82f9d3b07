import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as limitsRoute from "@/app/api/v1/organizations/[orgId]/limits/route";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { callRoute, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
let lead = "";
let tech = "";
const params = { orgId: demoShop.id };
const put = (json: unknown, cookie = lead) => callRoute(h(limitsRoute.PUT), { method: "PUT", json, params, cookie });

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  lead = await signInCookie("tobias@larkspur.example", DEMO_PASSWORD);
  tech = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  await pool.query("delete from organization_limits where organization_id = $1", [demoShop.id]);
});
afterAll(async () => {
  await pool.query("delete from organization_limits where organization_id = $1", [demoShop.id]);
  await pool.end();
});

describe("an organisation's diagnosis limits", () => {
  it("start at common practice and take a lead's own figures, which every member then reads", async () => {
    const start = await (await callRoute(h(limitsRoute.GET), { params, cookie: tech })).json();
    // Common practice (no single source): 0.3 V a side while charging, 13.5 to 14.8 V on 12 V.
    expect(start.limits).toMatchObject({ chargeSideV: 0.3, chargingLowV: 13.5, chargingHighV: 14.8, restSocPercent: 75 });
    expect(start.own).toEqual({});
    const res = await put({ limits: { chargeSideV: 0.2, chargingLowV: 13.2 } });
    expect(res.status).toBe(200);
    const now = await (await callRoute(h(limitsRoute.GET), { params, cookie: tech })).json();
    expect(now.limits).toMatchObject({ chargeSideV: 0.2, chargingLowV: 13.2, chargingHighV: 14.8 });
    expect(now.own).toEqual({ chargeSideV: 0.2, chargingLowV: 13.2 });
    expect(now.updatedByName).toBe("Tobias Venn");
    const audit = await pool.query("select action from audit_events where entity_id = $1 and action = 'limits.set'", [demoShop.id]);
    expect(audit.rowCount).toBeGreaterThan(0);
  });

  it("refuses figures out of range, a window upside down, unknown names and a technician, keeping what was saved", async () => {
    const far = await put({ limits: { chargeSideV: 5 } });
    expect(far.status).toBe(422);
    expect((await far.json()).error.issues[0]).toMatchObject({ path: "limits.chargeSideV" });
    const upside = await put({ limits: { chargingLowV: 14.9 } });
    expect(upside.status).toBe(422);
    expect(JSON.stringify(await upside.json())).toContain("below its high end");
    expect((await put({ limits: { groundV: 0.1 } })).status).toBe(422);
    expect((await put({ limits: { chargeSideV: 0.25 } }, tech)).status).toBe(403);
    const kept = await (await callRoute(h(limitsRoute.GET), { params, cookie: tech })).json();
    expect(kept.own).toEqual({ chargeSideV: 0.2, chargingLowV: 13.2 });
  });

  it("go back to the defaults when saved empty", async () => {
    const res = await put({ limits: {} });
    expect((await res.json()).limits.chargeSideV).toBe(0.3);
  });
});
