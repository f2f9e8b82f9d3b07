import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as invitations from "@/app/api/v1/organizations/[orgId]/invitations/route";
import * as members from "@/app/api/v1/organizations/[orgId]/members/route";
import * as member from "@/app/api/v1/organizations/[orgId]/members/[memberId]/route";
import * as org from "@/app/api/v1/organizations/[orgId]/route";
import * as orgs from "@/app/api/v1/organizations/route";
import { DEMO_PASSWORD, demoClass, demoPeople, demoShop } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { callRoute, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
const cookies: Record<string, string> = {};
const roleOf = (email: string) => demoPeople.find((p) => p.email === email)!.role;

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  for (const p of demoPeople) cookies[p.email] = await signInCookie(p.email, DEMO_PASSWORD);
});
afterAll(() => pool.end());

// Expected status by role, for a caller inside the organisation. Anyone outside it gets 404; signed out, 401.
type Row = { name: string; handler: Handler; method?: string; json?: unknown; params?: Record<string, string>; expect: Record<string, number> };
const all = (n: number) => ({ owner: n, lead: n, technician: n, student: n, viewer: n });

function rows(orgId: string, viewerMemberId: string): Row[] {
  return [
    { name: "GET organisation", handler: org.GET as Handler, expect: all(200) },
    // Renamed to the name it has, so the demo stays as it is for the browser tests.
    { name: "PATCH organisation", handler: org.PATCH as Handler, method: "PATCH", json: { name: orgId === demoShop.id ? demoShop.name : demoClass.name }, expect: { owner: 200, lead: 200, technician: 403, student: 403, viewer: 403 } },
    { name: "DELETE organisation", handler: org.DELETE as Handler, method: "DELETE", expect: { lead: 403, technician: 403, student: 403, viewer: 403 } },
    { name: "GET members", handler: members.GET as Handler, expect: { owner: 200, lead: 200, technician: 200, student: 403, viewer: 200 } },
    { name: "GET invitations", handler: invitations.GET as Handler, expect: { owner: 200, lead: 200, technician: 403, student: 403, viewer: 403 } },
    {
      name: "POST invitation",
      handler: invitations.POST as Handler,
      json: { email: `invitee-${orgId}@elsewhere.example`, role: "viewer" },
      expect: { owner: 201, lead: 201, technician: 403, student: 403, viewer: 403 },
    },
    { name: "PATCH member role", handler: member.PATCH as Handler, method: "PATCH", json: { role: "viewer" }, params: { memberId: viewerMemberId }, expect: { owner: 200, lead: 200, technician: 403, student: 403, viewer: 403 } },
    { name: "DELETE member", handler: member.DELETE as Handler, method: "DELETE", params: { memberId: "mem_does_not_matter" }, expect: { technician: 403, student: 403, viewer: 403 } },
  ];
}

describe("the permission table for organisation routes", () => {
  for (const [orgId, other] of [
    [demoShop.id, demoClass.id],
    [demoClass.id, demoShop.id],
  ]) {
    const insiders = demoPeople.filter((p) => p.org === orgId);
    const outsiders = demoPeople.filter((p) => p.org === other);
    const viewerMember = `mem_${insiders.find((p) => p.role === "viewer")!.id}`;
    for (const row of rows(orgId, viewerMember)) {
      it(`${row.name} in ${orgId}: each role, an outsider, and signed out`, async () => {
        const params = { orgId, ...row.params };
        for (const p of insiders) {
          const want = (row.expect as Record<string, number>)[roleOf(p.email)];
          if (want === undefined) continue;
          const res = await callRoute(row.handler, { method: row.method, json: row.json, params, cookie: cookies[p.email] });
          expect(res.status, `${p.role} ${p.email}`).toBe(want);
          if (want === 403) expect((await res.json()).error.code).toBe("forbidden");
        }
        for (const p of outsiders) {
          const res = await callRoute(row.handler, { method: row.method, json: row.json, params, cookie: cookies[p.email] });
          expect(res.status, `outsider ${p.email}`).toBe(404);
        }
        const anon = await callRoute(row.handler, { method: row.method, json: row.json, params });
        expect(anon.status).toBe(401);
      });
    }
  }

  it("lists each person's organisations with the role label of its kind", async () => {
    const res = await callRoute(orgs.GET as Handler, { cookie: cookies["jonah@fernmoor.example"] });
    const body = await res.json();
    const cls = body.organizations.find((o: { organizationId: string }) => o.organizationId === demoClass.id);
    expect(cls).toMatchObject({ kind: "class", role: "lead", roleLabel: "Instructor" });
    expect((await callRoute(orgs.GET as Handler)).status).toBe(401);
  });

  it("creates a class whose creator is its owner, and only the owner deletes it", async () => {
    const created = await callRoute(orgs.POST as Handler, { json: { name: "Evening class, batteries", kind: "class" }, cookie: cookies["jonah@fernmoor.example"] });
    expect(created.status).toBe(201);
    const id = (await created.json()).organization.id;
    expect((await callRoute(org.DELETE as Handler, { method: "DELETE", params: { orgId: id }, cookie: cookies["lena@fernmoor.example"] })).status).toBe(404);
    expect((await callRoute(org.DELETE as Handler, { method: "DELETE", params: { orgId: id }, cookie: cookies["jonah@fernmoor.example"] })).status).toBe(204);
  });

  it("refuses a role the kind of organisation does not offer, and protects the owner", async () => {
    const shopLead = cookies["tobias@larkspur.example"];
    const bad = await callRoute(invitations.POST as Handler, { json: { email: "x@else.example", role: "student" }, params: { orgId: demoShop.id }, cookie: shopLead });
    expect(bad.status).toBe(422);
    const owner = await callRoute(member.DELETE as Handler, { method: "DELETE", params: { orgId: demoShop.id, memberId: "mem_usr_demo_owner" }, cookie: shopLead });
    expect(owner.status).toBe(403);
    const invalid = await callRoute(orgs.POST as Handler, { json: { name: "x", kind: "garage" }, cookie: shopLead });
    expect(invalid.status).toBe(422);
    expect((await invalid.json()).error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["kind", "name"]);
  });
});
