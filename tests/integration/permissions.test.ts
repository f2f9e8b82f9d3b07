import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as attachmentDone from "@/app/api/v1/attachments/[attachmentId]/complete/route";
import * as attachmentFile from "@/app/api/v1/attachments/[attachmentId]/file/route";
import * as attachmentRoute from "@/app/api/v1/attachments/[attachmentId]/route";
import * as invitations from "@/app/api/v1/organizations/[orgId]/invitations/route";
import * as members from "@/app/api/v1/organizations/[orgId]/members/route";
import * as member from "@/app/api/v1/organizations/[orgId]/members/[memberId]/route";
import * as orgLimits from "@/app/api/v1/organizations/[orgId]/limits/route";
import * as orgPlan from "@/app/api/v1/organizations/[orgId]/plans/[planId]/route";
import * as orgPlans from "@/app/api/v1/organizations/[orgId]/plans/route";
import { BUILT_IN_PLANS } from "@/lib/diagnosis/plans";
import * as org from "@/app/api/v1/organizations/[orgId]/route";
import * as orgs from "@/app/api/v1/organizations/route";
import * as circuitPut from "@/app/api/v1/circuits/[circuitId]/route";
import * as exportRoute from "@/app/api/v1/circuits/[circuitId]/export/route";
import * as readingsRoute from "@/app/api/v1/circuits/[circuitId]/readings/route";
import * as restoreRoute from "@/app/api/v1/circuits/[circuitId]/restore/route";
import * as revisionRoute from "@/app/api/v1/circuits/[circuitId]/revisions/[version]/route";
import * as revisionsRoute from "@/app/api/v1/circuits/[circuitId]/revisions/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as importRoute from "@/app/api/v1/jobs/[jobId]/import/route";
import * as jobRoute from "@/app/api/v1/jobs/[jobId]/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import * as readingRoute from "@/app/api/v1/readings/[readingId]/route";
import * as jobSizings from "@/app/api/v1/jobs/[jobId]/sizings/route";
import * as sizingRoute from "@/app/api/v1/sizings/[sizingId]/route";
import * as reportPdf from "@/app/api/v1/jobs/[jobId]/report.pdf/route";
import * as reportEmail from "@/app/api/v1/jobs/[jobId]/report/email/route";
import * as circuitLesson from "@/app/api/v1/circuits/[circuitId]/lesson/route";
import * as lessonActivity from "@/app/api/v1/lessons/[lessonId]/activity/route";
import * as lessonCopy from "@/app/api/v1/lessons/[lessonId]/copy/route";
import * as lessonRoute from "@/app/api/v1/lessons/[lessonId]/route";
import * as lessonsRoute from "@/app/api/v1/lessons/route";
import * as jobAttachments from "@/app/api/v1/jobs/[jobId]/attachments/route";
import * as jobShares from "@/app/api/v1/jobs/[jobId]/share-links/route";
import * as shareRoute from "@/app/api/v1/share-links/[linkId]/route";
import * as readingsCsv from "@/app/api/v1/circuits/[circuitId]/readings.csv/route";
import * as resultsCsv from "@/app/api/v1/circuits/[circuitId]/results.csv/route";
import * as diagnosisRoute from "@/app/api/v1/circuits/[circuitId]/diagnosis/route";
import * as planVerdictRoute from "@/app/api/v1/circuits/[circuitId]/plans/[planId]/verdict/route";
import { DEMO_PASSWORD, demoClass, demoPeople, demoShop } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import * as authRoute from "@/app/api/auth/[...all]/route";
import { auth } from "@/lib/auth/server";
import { AUTH_ROUTES, authRouteOpen } from "@/lib/auth/permissions";
import { callRoute, removeTestJobs, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
const cookies: Record<string, string> = {};
const RUN = Date.now().toString(36);
const roleOf = (email: string) => demoPeople.find((p) => p.email === email)!.role;

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  for (const p of demoPeople) cookies[p.email] = await signInCookie(p.email, DEMO_PASSWORD);
});
afterAll(async () => {
  await pool.query("delete from organization_plans where plan_key like 'perm-%'");
  await removeTestJobs(pool);
  await pool.end();
});

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
      // One address per inviter: a second invitation to an address already waiting is refused (409).
      json: (who: string) => ({ email: `invitee-${orgId}-${who.split("@")[0]}-${RUN}@elsewhere.example`, role: "viewer" }),
      expect: { owner: 201, lead: 201, technician: 403, student: 403, viewer: 403 },
    },
    { name: "PATCH member role", handler: member.PATCH as Handler, method: "PATCH", json: { role: "viewer" }, params: { memberId: viewerMemberId }, expect: { owner: 200, lead: 200, technician: 403, student: 403, viewer: 403 } },
    { name: "GET limits", handler: orgLimits.GET as Handler, expect: all(200) },
    // Set to the defaults' own values, so the demo judges readings as before for the browser tests.
    { name: "PUT limits", handler: orgLimits.PUT as Handler, method: "PUT", json: { limits: { chargeSideV: 0.3 } }, expect: { owner: 200, lead: 200, technician: 403, student: 403, viewer: 403 } },
    { name: "GET plans", handler: orgPlans.GET as Handler, expect: all(200) },
    {
      name: "POST plan",
      handler: orgPlans.POST as Handler,
      // A fresh id on every call, so each role that may add one adds its own.
      get json() {
        return { plan: { ...BUILT_IN_PLANS[1], id: `perm-${Math.random().toString(36).slice(2, 10)}`, name: "Permission plan" } };
      },
      expect: { owner: 201, lead: 201, technician: 403, student: 403, viewer: 403 },
    },
    { name: "DELETE plan", handler: orgPlan.DELETE as Handler, method: "DELETE", params: { planId: "pln_not_there" }, expect: { owner: 404, lead: 404, technician: 403, student: 403, viewer: 403 } },
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
          const json = typeof row.json === "function" ? row.json(p.email) : row.json;
          const res = await callRoute(row.handler, { method: row.method, json, params, cookie: cookies[p.email] });
          expect(res.status, `${p.role} ${p.email}`).toBe(want);
          if (want === 403) expect((await res.json()).error.code).toBe("forbidden");
        }
        for (const p of outsiders) {
          const res = await callRoute(row.handler, { method: row.method, json: typeof row.json === "function" ? row.json(p.email) : row.json, params, cookie: cookies[p.email] });
          expect(res.status, `outsider ${p.email}`).toBe(404);
        }
        const anon = await callRoute(row.handler, { method: row.method, json: typeof row.json === "function" ? row.json("anon@x") : row.json, params });
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

describe("the permission table for work routes (jobs, circuits, revisions, readings, sizings)", () => {
  // Each row runs against a job owned by one person: roles that see all work may read it, roles that see only their
  // own work get 404 on another's, read-only roles get 403 on a change; outsiders 404; signed out 401.
  type Fx = { jobId: string; circuitId: string; readingId: string; sizingId: string; shareLinkId: string; attachmentId: string };
  const sizing = { title: "Light bar feed", inputs: { current: "20 A" }, request: { systemVoltage: 12, currentA: 20, lengthM: 6 } };
  type WorkRow = { name: string; need: "read" | "edit"; ok: number; file?: true; call: (cookie: string | undefined, fx: Fx) => Promise<Response> };
  const R = (f: unknown) => f as Handler;
  const doc = { schema: "ampwright.circuit/1", name: "Perm check", systemVoltage: 12, components: [{ id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.01 }], wires: [] };

  /** A finished upload of a small PNG (through the presigned URL to the object store, as the browser sends it). */
  async function attach(ownerCookie: string, jobId: string): Promise<string> {
    const png = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==", "base64");
    const started = await (await callRoute(R(jobAttachments.POST), { json: { fileName: "p.png", contentType: "image/png", sizeBytes: png.length }, params: { jobId }, cookie: ownerCookie })).json();
    await fetch(started.upload.url, { method: "PUT", headers: started.upload.headers, body: new Uint8Array(png) });
    expect((await callRoute(R(attachmentDone.POST), { method: "POST", params: { attachmentId: started.attachment.id }, cookie: ownerCookie })).status).toBe(200);
    return started.attachment.id;
  }

  async function fixture(ownerCookie: string, orgId: string, file = false): Promise<Fx> {
    const job = await callRoute(R(jobsRoute.POST), { json: { organizationId: orgId, title: "Permission fixture" }, cookie: ownerCookie });
    expect(job.status).toBe(201);
    const jobId = (await job.json()).job.id;
    const c = await callRoute(R(jobCircuits.POST), { json: { document: doc }, params: { jobId }, cookie: ownerCookie });
    const circuitId = (await c.json()).circuit.id;
    const r = await callRoute(R(readingsRoute.POST), { json: { positive: "B1.pos", negative: "B1.neg", value: 12.6 }, params: { circuitId }, cookie: ownerCookie });
    const z = await callRoute(R(jobSizings.POST), { json: sizing, params: { jobId }, cookie: ownerCookie });
    const s = await callRoute(R(jobShares.POST), { json: { expiresInDays: 1 }, params: { jobId }, cookie: ownerCookie });
    const attachmentId = file ? await attach(ownerCookie, jobId) : "";
    return { jobId, circuitId, readingId: (await r.json()).reading.id, sizingId: (await z.json()).sizing.id, shareLinkId: (await s.json()).link.id, attachmentId };
  }
  const putDoc = async (cookie: string | undefined, circuitId: string) => {
    const req = new Request(`${process.env.APP_URL ?? "http://127.0.0.1:3100"}/api/v1/circuits/x`, {
      method: "PUT",
      headers: { origin: process.env.APP_URL ?? "http://127.0.0.1:3100", "content-type": "application/json", "if-match": '"1"', ...(cookie ? { cookie } : {}) },
      body: JSON.stringify({ document: { ...doc, name: "Perm check, saved" } }),
    });
    return (circuitPut.PUT as unknown as Handler)(req, { params: Promise.resolve({ circuitId }) });
  };

  const workRows: WorkRow[] = [
    { name: "GET job", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(jobRoute.GET), { params: { jobId: fx.jobId }, cookie }) },
    { name: "GET job circuits", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(jobCircuits.GET), { params: { jobId: fx.jobId }, cookie }) },
    { name: "GET circuit", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(circuitPut.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "GET revisions", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(revisionsRoute.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "GET revision 1", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(revisionRoute.GET), { params: { circuitId: fx.circuitId, version: "1" }, cookie }) },
    { name: "GET readings", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(readingsRoute.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "GET export", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(exportRoute.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "PATCH job", need: "edit", ok: 200, call: (cookie, fx) => callRoute(R(jobRoute.PATCH), { method: "PATCH", json: { status: "diagnosed" }, params: { jobId: fx.jobId }, cookie }) },
    { name: "DELETE job", need: "edit", ok: 204, call: (cookie, fx) => callRoute(R(jobRoute.DELETE), { method: "DELETE", params: { jobId: fx.jobId }, cookie }) },
    { name: "POST circuit", need: "edit", ok: 201, call: (cookie, fx) => callRoute(R(jobCircuits.POST), { json: { name: "Another" }, params: { jobId: fx.jobId }, cookie }) },
    { name: "POST import", need: "edit", ok: 201, call: (cookie, fx) => callRoute(R(importRoute.POST), { json: { document: doc }, params: { jobId: fx.jobId }, cookie }) },
    { name: "PUT circuit", need: "edit", ok: 200, call: (cookie, fx) => putDoc(cookie, fx.circuitId) },
    { name: "DELETE circuit", need: "edit", ok: 204, call: (cookie, fx) => callRoute(R(circuitPut.DELETE), { method: "DELETE", params: { circuitId: fx.circuitId }, cookie }) },
    { name: "POST restore", need: "edit", ok: 200, call: (cookie, fx) => callRoute(R(restoreRoute.POST), { json: { version: 1 }, params: { circuitId: fx.circuitId }, cookie }) },
    {
      name: "POST reading",
      need: "edit",
      ok: 201,
      call: (cookie, fx) => callRoute(R(readingsRoute.POST), { json: { positive: "B1.pos", negative: "B1.neg", value: 12.5 }, params: { circuitId: fx.circuitId }, cookie }),
    },
    { name: "PATCH reading", need: "edit", ok: 200, call: (cookie, fx) => callRoute(R(readingRoute.PATCH), { method: "PATCH", json: { note: "checked" }, params: { readingId: fx.readingId }, cookie }) },
    { name: "DELETE reading", need: "edit", ok: 204, call: (cookie, fx) => callRoute(R(readingRoute.DELETE), { method: "DELETE", params: { readingId: fx.readingId }, cookie }) },
    { name: "GET job sizings", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(jobSizings.GET), { params: { jobId: fx.jobId }, cookie }) },
    { name: "GET sizing", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(sizingRoute.GET), { params: { sizingId: fx.sizingId }, cookie }) },
    { name: "POST sizing", need: "edit", ok: 201, call: (cookie, fx) => callRoute(R(jobSizings.POST), { json: sizing, params: { jobId: fx.jobId }, cookie }) },
    { name: "DELETE sizing", need: "edit", ok: 204, call: (cookie, fx) => callRoute(R(sizingRoute.DELETE), { method: "DELETE", params: { sizingId: fx.sizingId }, cookie }) },
    { name: "GET report PDF", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(reportPdf.GET), { params: { jobId: fx.jobId }, cookie }) },
    { name: "GET readings CSV", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(readingsCsv.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "GET results CSV", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(resultsCsv.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "GET diagnosis", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(diagnosisRoute.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    { name: "GET plan verdict", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(planVerdictRoute.GET), { params: { circuitId: fx.circuitId, planId: "charging" }, cookie }) },
    {
      name: "POST report e-mail",
      need: "edit",
      ok: 202,
      call: (cookie, fx) => callRoute(R(reportEmail.POST), { json: { to: "permission-table@customer.example" }, params: { jobId: fx.jobId }, cookie }),
    },
    { name: "GET share links", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(jobShares.GET), { params: { jobId: fx.jobId }, cookie }) },
    { name: "POST share link", need: "edit", ok: 201, call: (cookie, fx) => callRoute(R(jobShares.POST), { json: { circuitId: fx.circuitId }, params: { jobId: fx.jobId }, cookie }) },
    { name: "GET share link", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(shareRoute.GET), { params: { linkId: fx.shareLinkId }, cookie }) },
    { name: "DELETE share link", need: "edit", ok: 200, call: (cookie, fx) => callRoute(R(shareRoute.DELETE), { method: "DELETE", params: { linkId: fx.shareLinkId }, cookie }) },
    { name: "GET attachments", need: "read", ok: 200, call: (cookie, fx) => callRoute(R(jobAttachments.GET), { params: { jobId: fx.jobId }, cookie }) },
    {
      name: "POST attachment",
      need: "edit",
      ok: 201,
      call: (cookie, fx) => callRoute(R(jobAttachments.POST), { json: { fileName: "q.jpg", contentType: "image/jpeg", sizeBytes: 2000 }, params: { jobId: fx.jobId }, cookie }),
    },
    { name: "GET attachment", need: "read", ok: 200, file: true, call: (cookie, fx) => callRoute(R(attachmentRoute.GET), { params: { attachmentId: fx.attachmentId }, cookie }) },
    { name: "GET attachment file", need: "read", ok: 302, file: true, call: (cookie, fx) => callRoute(R(attachmentFile.GET), { params: { attachmentId: fx.attachmentId }, cookie }) },
    { name: "POST attachment complete", need: "edit", ok: 200, file: true, call: (cookie, fx) => callRoute(R(attachmentDone.POST), { method: "POST", params: { attachmentId: fx.attachmentId }, cookie }) },
    { name: "DELETE attachment", need: "edit", ok: 204, file: true, call: (cookie, fx) => callRoute(R(attachmentRoute.DELETE), { method: "DELETE", params: { attachmentId: fx.attachmentId }, cookie }) },
  ];

  const cases = [
    { org: demoShop.id, ownerEmail: "priya@larkspur.example", outsider: "ines@fernmoor.example" },
    { org: demoClass.id, ownerEmail: "ines@fernmoor.example", outsider: "priya@larkspur.example" },
  ];
  for (const c of cases) {
    for (const row of workRows) {
      it(`${row.name} on ${c.ownerEmail}'s job: each role, own or not, an outsider, and signed out`, async () => {
        const insiders = demoPeople.filter((p) => p.org === c.org);
        for (const p of insiders) {
          const own = p.email === c.ownerEmail;
          const seesAll = p.role !== "student";
          const edits = p.role === "owner" || p.role === "lead" || p.role === "technician" || (p.role === "student" && own);
          const want = !seesAll && !own ? 404 : row.need === "edit" && !edits ? 403 : row.ok;
          const fx = await fixture(cookies[c.ownerEmail], c.org, row.file);
          const res = await row.call(cookies[p.email], fx);
          expect(res.status, `${p.role} ${p.email}`).toBe(want);
        }
        const fx = await fixture(cookies[c.ownerEmail], c.org, row.file);
        expect((await row.call(cookies[c.outsider], fx)).status, "outsider").toBe(404);
        expect((await row.call(undefined, fx)).status, "signed out").toBe(401);
      });
    }
  }

  it("lists only a student's own jobs in a class, and everyone's to its instructor", async () => {
    // The demo's practice jobs: one by each student.
    const list = async (email: string) =>
      (await (await callRoute(R(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoClass.id}&q=practice&limit=100`, cookie: cookies[email] })).json()).jobs as { ownerId: string }[];
    const theo = await list("theo@fernmoor.example");
    expect(theo.length).toBeGreaterThan(0);
    expect(new Set(theo.map((j) => j.ownerId))).toEqual(new Set(["usr_demo_student2"]));
    const lena = await list("lena@fernmoor.example");
    expect(new Set(lena.map((j) => j.ownerId))).toEqual(new Set(["usr_demo_student1", "usr_demo_student2"]));
    expect((await callRoute(R(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoClass.id}`, cookie: cookies["priya@larkspur.example"] })).status).toBe(404);
    expect((await callRoute(R(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoClass.id}` })).status).toBe(401);
  });
});

describe("the permission table for lessons", () => {
  // Lessons live in a class: every member reads them; making a copy needs the right to make work; instructors
  // (owner, lead) publish, see activity and withdraw. Anyone outside the class gets 404; signed out, 401.
  const R = (f: unknown) => f as Handler;
  const doc = { schema: "ampwright.circuit/1", name: "Lesson perm check", systemVoltage: 12, components: [{ id: "B1", kind: "battery", openCircuitVoltage: 12.6, internalResistance: 0.01 }], wires: [] };
  type Fx = { circuitId: string; lessonId: string };
  async function fixture(): Promise<Fx> {
    const lena = cookies["lena@fernmoor.example"];
    const job = await callRoute(R(jobsRoute.POST), { json: { organizationId: demoClass.id, title: "Lesson permission fixture" }, cookie: lena });
    const jobId = (await job.json()).job.id;
    const c = await callRoute(R(jobCircuits.POST), { json: { document: doc }, params: { jobId }, cookie: lena });
    const circuitId = (await c.json()).circuit.id;
    const l = await callRoute(R(circuitLesson.POST), { json: { title: "Permission lesson" }, params: { circuitId }, cookie: lena });
    return { circuitId, lessonId: (await l.json()).lesson.id };
  }
  type LessonRow = { name: string; expect: Record<string, number>; call: (cookie: string | undefined, fx: Fx) => Promise<Response> };
  const lessonRows: LessonRow[] = [
    { name: "GET lessons", expect: { owner: 200, lead: 200, student: 200, viewer: 200 }, call: (cookie) => callRoute(R(lessonsRoute.GET), { cookie }) },
    { name: "GET lesson", expect: { owner: 200, lead: 200, student: 200, viewer: 200 }, call: (cookie, fx) => callRoute(R(lessonRoute.GET), { params: { lessonId: fx.lessonId }, cookie }) },
    { name: "POST lesson copy", expect: { owner: 201, lead: 201, student: 201, viewer: 403 }, call: (cookie, fx) => callRoute(R(lessonCopy.POST), { method: "POST", params: { lessonId: fx.lessonId }, cookie }) },
    { name: "GET lesson activity", expect: { owner: 200, lead: 200, student: 403, viewer: 403 }, call: (cookie, fx) => callRoute(R(lessonActivity.GET), { params: { lessonId: fx.lessonId }, cookie }) },
    { name: "DELETE lesson", expect: { owner: 204, lead: 204, student: 403, viewer: 403 }, call: (cookie, fx) => callRoute(R(lessonRoute.DELETE), { method: "DELETE", params: { lessonId: fx.lessonId }, cookie }) },
    // The instructor's circuit is not a student's own work, so a student does not see it at all.
    { name: "GET circuit lesson", expect: { owner: 200, lead: 200, student: 404, viewer: 200 }, call: (cookie, fx) => callRoute(R(circuitLesson.GET), { params: { circuitId: fx.circuitId }, cookie }) },
    {
      name: "POST circuit lesson (republish)",
      expect: { owner: 200, lead: 200, student: 404, viewer: 403 },
      call: (cookie, fx) => callRoute(R(circuitLesson.POST), { json: { title: "Permission lesson, again" }, params: { circuitId: fx.circuitId }, cookie }),
    },
  ];
  for (const row of lessonRows) {
    it(`${row.name}: each class role, someone from the shop, and signed out`, async () => {
      for (const p of demoPeople.filter((x) => x.org === demoClass.id)) {
        const fx = await fixture();
        expect((await row.call(cookies[p.email], fx)).status, `${p.role} ${p.email}`).toBe(row.expect[p.role]);
      }
      const fx = await fixture();
      const outsider = await row.call(cookies["priya@larkspur.example"], fx);
      expect(outsider.status, "outsider").toBe(row.name === "GET lessons" ? 200 : 404);
      if (row.name === "GET lessons") expect((await outsider.json()).lessons).toEqual([]);
      expect((await row.call(undefined, fx)).status, "signed out").toBe(401);
    });
  }
  afterAll(async () => {
    await pool.query("delete from lessons where id <> 'lsn_demo_bench'");
  });
});

describe("the permission table for better-auth's own routes (AUTH_ROUTES)", () => {
  const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
  const endpoints = Object.values(auth.api as Record<string, { path?: string; options?: { method?: string | string[] } }>)
    .filter((e) => typeof e?.path === "string")
    .flatMap((e) => [e.options?.method ?? "GET"].flat().map((m) => ({ method: m as "GET" | "POST", path: e.path!.replace(/:\w+/g, "x1") })))
    .filter((e) => e.method === "GET" || e.method === "POST");

  it("answers 404 to every route not in the table, for every role and signed out", async () => {
    const closed = endpoints.filter((e) => !authRouteOpen(e.method, e.path));
    // The organisation plugin's routes among them: none may say whether an organisation exists or who is in it.
    expect(closed.filter((e) => e.path.startsWith("/organization/")).length).toBeGreaterThan(15);
    for (const e of closed) {
      for (const cookie of [...Object.values(cookies), undefined]) {
        const req = new Request(new URL(`/api/auth${e.path}?organizationId=${demoShop.id}`, base), {
          method: e.method,
          headers: { origin: base, "content-type": "application/json", ...(cookie ? { cookie } : {}) },
          body: e.method === "POST" ? JSON.stringify({ organizationId: demoShop.id, slug: "larkspur-road", email: "x@y.example" }) : undefined,
        });
        const res = await (e.method === "GET" ? authRoute.GET(req) : authRoute.POST(req));
        expect(res.status, `${e.method} ${e.path}`).toBe(404);
      }
    }
  });

  it("lists only routes the library has", () => {
    for (const r of AUTH_ROUTES) expect(endpoints.some((e) => e.method === r.method && authRouteOpen(r.method, e.path)), `${r.method} ${r.path}`).toBe(true);
  });
});
