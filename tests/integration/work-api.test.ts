import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as circuitRoute from "@/app/api/v1/circuits/[circuitId]/route";
import * as exportRoute from "@/app/api/v1/circuits/[circuitId]/export/route";
import * as readingsRoute from "@/app/api/v1/circuits/[circuitId]/readings/route";
import * as restoreRoute from "@/app/api/v1/circuits/[circuitId]/restore/route";
import * as revisionRoute from "@/app/api/v1/circuits/[circuitId]/revisions/[version]/route";
import * as revisionsRoute from "@/app/api/v1/circuits/[circuitId]/revisions/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as importRoute from "@/app/api/v1/jobs/[jobId]/import/route";
import * as jobRoute from "@/app/api/v1/jobs/[jobId]/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import * as openapi from "@/app/api/v1/openapi.json/route";
import * as readingRoute from "@/app/api/v1/readings/[readingId]/route";
import * as jobSizings from "@/app/api/v1/jobs/[jobId]/sizings/route";
import * as sizingRoute from "@/app/api/v1/sizings/[sizingId]/route";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { pickupCharging } from "@/db/demo-work";
import { seedDemo } from "@/db/seed";
import { callRoute, removeTestJobs, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
let tech = "";
let lead = "";
let viewer = "";

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  tech = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  lead = await signInCookie("tobias@larkspur.example", DEMO_PASSWORD);
  viewer = await signInCookie("sam@larkspur.example", DEMO_PASSWORD);
});
afterAll(async () => {
  await removeTestJobs(pool);
  await pool.end();
});

async function newJob(cookie: string, title = "Test job") {
  const res = await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title, vehicle: "Test pickup", complaint: "Battery light" }, cookie });
  expect(res.status).toBe(201);
  return (await res.json()).job.id as string;
}

async function newCircuit(cookie: string, jobId: string, document: unknown = pickupCharging) {
  const res = await callRoute(h(jobCircuits.POST), { json: { document }, params: { jobId }, cookie });
  expect(res.status).toBe(201);
  return (await res.json()).circuit.id as string;
}

function put(circuitId: string, document: unknown, cookie: string, ifMatch?: string) {
  const req = new Request("http://127.0.0.1:3100/api/v1/circuits/x", {
    method: "PUT",
    headers: { origin: process.env.APP_URL ?? "http://127.0.0.1:3100", "content-type": "application/json", cookie, ...(ifMatch ? { "if-match": ifMatch } : {}) },
    body: JSON.stringify({ document }),
  });
  return (circuitRoute.PUT as unknown as Handler)(req, { params: Promise.resolve({ circuitId }) });
}

describe("jobs", () => {
  it("opens a job, lists it, finds it by search and status, changes and deletes it", async () => {
    const id = await newJob(tech, "Whining alternator, Unit 77");
    const listed = await (await callRoute(h(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoShop.id}&q=unit%2077`, cookie: tech })).json();
    expect(listed.jobs.map((j: { id: string }) => j.id)).toEqual([id]);
    expect(listed.organization.name).toBe(demoShop.name);

    const patched = await callRoute(h(jobRoute.PATCH), { method: "PATCH", json: { status: "diagnosed" }, params: { jobId: id }, cookie: tech });
    expect(patched.status).toBe(200);
    expect((await patched.json()).job.status).toBe("diagnosed");
    const byStatus = await (await callRoute(h(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoShop.id}&status=diagnosed&limit=100`, cookie: tech })).json();
    expect(byStatus.jobs.every((j: { status: string }) => j.status === "diagnosed")).toBe(true);
    expect(byStatus.jobs.some((j: { id: string }) => j.id === id)).toBe(true);

    expect((await callRoute(h(jobRoute.DELETE), { method: "DELETE", params: { jobId: id }, cookie: tech })).status).toBe(204);
    expect((await callRoute(h(jobRoute.GET), { params: { jobId: id }, cookie: tech })).status).toBe(404);
    const trail = await pool.query("select action from audit_events where entity_id = $1 order by id", [id]);
    expect(trail.rows.map((r) => r.action)).toEqual(["job.create", "job.update", "job.delete"]);
  });

  it("pages through the list with a cursor, each job once, in order", async () => {
    const made: string[] = [];
    for (let i = 0; i < 7; i++) made.push(await newJob(lead, `Paging check ${String.fromCharCode(65 + i)}`));
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const path: string = `/api/v1/jobs?organizationId=${demoShop.id}&q=Paging%20check&sort=title&limit=3${cursor ? `&cursor=${cursor}` : ""}`;
      const body = await (await callRoute(h(jobsRoute.GET), { path, cookie: lead })).json();
      seen.push(...body.jobs.map((j: { id: string }) => j.id));
      cursor = body.nextCursor;
      pages++;
    } while (cursor && pages < 10);
    expect(pages).toBe(3);
    expect(seen).toEqual(made); // titles A..G sort in the order they were made
  });

  it("answers 422 with the field paths for bad input, 400 for malformed JSON, and changes nothing", async () => {
    const before = (await pool.query("select count(*)::int n from jobs")).rows[0].n;
    const bad = await callRoute(h(jobsRoute.POST), { json: { title: "x", systemVoltage: "twelve", colour: "red" }, cookie: tech });
    expect(bad.status).toBe(422);
    const paths = (await bad.json()).error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["title", "systemVoltage"]));
    const req = new Request("http://127.0.0.1:3100/api/v1/jobs", { method: "POST", headers: { origin: process.env.APP_URL ?? "http://127.0.0.1:3100", "content-type": "application/json", cookie: tech }, body: "{title:" });
    expect((await (jobsRoute.POST as unknown as Handler)(req, { params: Promise.resolve({}) })).status).toBe(400);
    const badQuery = await callRoute(h(jobsRoute.GET), { path: "/api/v1/jobs?sort=colour&limit=0", cookie: tech });
    expect(badQuery.status).toBe(422);
    const badCursor = await callRoute(h(jobsRoute.GET), { path: "/api/v1/jobs?cursor=not-ours", cookie: tech });
    expect(badCursor.status).toBe(422);
    expect((await pool.query("select count(*)::int n from jobs")).rows[0].n).toBe(before);
  });

  it("lets a viewer read but not open or change jobs", async () => {
    const list = await callRoute(h(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoShop.id}`, cookie: viewer });
    expect(list.status).toBe(200);
    expect((await list.json()).canCreate).toBe(false);
    expect((await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: "Not allowed" }, cookie: viewer })).status).toBe(403);
  });
});

describe("circuits: versions, If-Match and history", () => {
  it("saves with If-Match, refuses a stale version with 412 and the current document, and 428 without the header", async () => {
    const jobId = await newJob(tech);
    const id = await newCircuit(tech, jobId);
    const got = await callRoute(h(circuitRoute.GET), { params: { circuitId: id }, cookie: tech });
    expect(got.headers.get("etag")).toBe('"1"');
    const doc = (await got.json()).circuit.document;

    expect((await put(id, doc, tech)).status).toBe(428);
    const saved = await put(id, { ...doc, name: "Charging circuit, bracket cleaned" }, tech, '"1"');
    expect(saved.status).toBe(200);
    expect(saved.headers.get("etag")).toBe('"2"');
    const stale = await put(id, { ...doc, name: "Someone else's edit" }, lead, '"1"');
    expect(stale.status).toBe(412);
    const body = await stale.json();
    expect(body.error.code).toBe("stale-version");
    expect(body.current.version).toBe(2);
    expect(body.current.document.name).toBe("Charging circuit, bracket cleaned");
    expect((await put(id, doc, tech, "W/1")).status).toBe(400);
  });

  it("validates documents with paths under document, and keeps the saved version", async () => {
    const jobId = await newJob(tech);
    const id = await newCircuit(tech, jobId);
    const broken = { ...pickupCharging, components: [{ ...pickupCharging.components[0], openCircuitVoltage: "12.6" }, ...pickupCharging.components.slice(1)] };
    const res = await put(id, broken, tech, '"1"');
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].path).toBe("document.components.0.openCircuitVoltage");
    const still = await (await callRoute(h(circuitRoute.GET), { params: { circuitId: id }, cookie: tech })).json();
    expect(still.circuit.version).toBe(1);
    expect(still.circuit.document).toEqual(pickupCharging);
  });

  it("answers 413 for a body over 4 MB", async () => {
    const jobId = await newJob(tech);
    const id = await newCircuit(tech, jobId);
    const huge = { ...pickupCharging, name: "x".repeat(100), components: pickupCharging.components.map((c) => ({ ...c, label: "y".repeat(150) })), padding: "z".repeat(4_300_000) };
    expect((await put(id, huge, tech, '"1"')).status).toBe(413);
  });

  it("lists revisions, reads one, and restores an old one as a new version", async () => {
    const jobId = await newJob(tech);
    const id = await newCircuit(tech, jobId);
    const v2 = { ...pickupCharging, name: "Version two" };
    expect((await put(id, v2, tech, '"1"')).status).toBe(200);
    const revs = await (await callRoute(h(revisionsRoute.GET), { params: { circuitId: id }, cookie: tech })).json();
    expect(revs.revisions.map((r: { version: number }) => r.version)).toEqual([2, 1]);
    expect(revs.revisions[0].createdByName).toBe("Priya Halvorsen");
    const one = await (await callRoute(h(revisionRoute.GET), { params: { circuitId: id, version: "1" }, cookie: tech })).json();
    expect(one.revision.document.name).toBe(pickupCharging.name);
    expect((await callRoute(h(revisionRoute.GET), { params: { circuitId: id, version: "9" }, cookie: tech })).status).toBe(404);

    const badTag = new Request("http://127.0.0.1:3100/api/v1/circuits/x/restore", {
      method: "POST",
      headers: { origin: process.env.APP_URL ?? "http://127.0.0.1:3100", "content-type": "application/json", cookie: tech, "if-match": "W/1" },
      body: JSON.stringify({ version: 1 }),
    });
    expect((await (restoreRoute.POST as unknown as Handler)(badTag, { params: Promise.resolve({ circuitId: id }) })).status).toBe(400);
    const restored = await callRoute(h(restoreRoute.POST), { json: { version: 1 }, params: { circuitId: id }, cookie: tech });
    expect(restored.status).toBe(200);
    expect((await restored.json()).version).toBe(3);
    const now = await (await callRoute(h(circuitRoute.GET), { params: { circuitId: id }, cookie: tech })).json();
    expect(now.circuit.document).toEqual(pickupCharging);
    const all = await (await callRoute(h(revisionsRoute.GET), { params: { circuitId: id }, cookie: tech })).json();
    expect(all.revisions.map((r: { version: number; message: string }) => [r.version, r.message])).toEqual([
      [3, "Restored version 1"],
      [2, null],
      [1, "Created"],
    ]);
  });

  it("creates an empty circuit by name at the job's system voltage", async () => {
    const jobId = await newJob(tech);
    const res = await callRoute(h(jobCircuits.POST), { json: { name: "Starting circuit" }, params: { jobId }, cookie: tech });
    expect(res.status).toBe(201);
    const c = (await res.json()).circuit;
    expect(c.document).toEqual({ schema: "ampwright.circuit/1", name: "Starting circuit", systemVoltage: 12, components: [], wires: [] });
    expect((await callRoute(h(jobCircuits.POST), { json: {}, params: { jobId }, cookie: tech })).status).toBe(422);
  });
});

describe("the concurrency of saves", () => {
  it("50 writers on version 1: one wins, 49 get 412; retried, all 51 versions are kept, each a distinct writer's", async () => {
    const jobId = await newJob(tech);
    const id = await newCircuit(tech, jobId);
    const docOf = (i: number) => ({ ...pickupCharging, name: `Writer ${i}` });
    const first = await Promise.all(Array.from({ length: 50 }, (_, i) => put(id, docOf(i), i % 2 ? tech : lead, '"1"')));
    const statuses = first.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 412)).toHaveLength(49);
    expect((await pool.query("select version from circuit_revisions where circuit_id = $1 order by version", [id])).rows.map((r) => r.version)).toEqual([1, 2]);

    const losers = statuses.map((s, i) => (s === 412 ? i : -1)).filter((i) => i >= 0);
    await Promise.all(
      losers.map(async (i) => {
        for (let attempt = 0; attempt < 200; attempt++) {
          const cur = await callRoute(h(circuitRoute.GET), { params: { circuitId: id }, cookie: tech });
          const res = await put(id, docOf(i), tech, cur.headers.get("etag")!);
          if (res.status === 200) return;
          expect(res.status).toBe(412);
        }
        throw new Error(`writer ${i} never got through`);
      }),
    );
    const revs = await pool.query("select version, name from circuit_revisions where circuit_id = $1 order by version", [id]);
    expect(revs.rows.map((r) => r.version)).toEqual(Array.from({ length: 51 }, (_, i) => i + 1));
    const writers = revs.rows.slice(1).map((r) => r.name);
    expect(new Set(writers).size).toBe(50);
    expect((await pool.query("select version from circuits where id = $1", [id])).rows[0].version).toBe(51);
  });
});

describe("readings, export and import", () => {
  it("records, corrects and removes readings, checking the probes against the circuit", async () => {
    const jobId = await newJob(tech);
    const id = await newCircuit(tech, jobId);
    const ok = await callRoute(h(readingsRoute.POST), {
      json: { stateId: "charge", positive: "B1.neg", negative: "A1.case", value: 1.69, unit: "V", currentA: 49, note: "ground side" },
      params: { circuitId: id },
      cookie: tech,
    });
    expect(ok.status).toBe(201);
    const reading = (await ok.json()).reading;
    expect(reading).toMatchObject({ positive: "B1.neg", negative: "A1.case", value: 1.69, unit: "V", currentA: 49, takenByName: "Priya Halvorsen" });

    const bad = await callRoute(h(readingsRoute.POST), { json: { stateId: "idle", positive: "B9.pos", negative: "B1.neg", value: 1 }, params: { circuitId: id }, cookie: tech });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["positive", "stateId"]);

    const fixed = await callRoute(h(readingRoute.PATCH), { method: "PATCH", json: { value: 1690, unit: "mV" }, params: { readingId: reading.id }, cookie: tech });
    expect(fixed.status).toBe(200);
    expect((await fixed.json()).reading).toMatchObject({ value: 1690, unit: "mV" });
    expect((await callRoute(h(readingRoute.PATCH), { method: "PATCH", json: {}, params: { readingId: reading.id }, cookie: tech })).status).toBe(422);
    expect((await callRoute(h(readingRoute.PATCH), { method: "PATCH", json: { value: 1 }, params: { readingId: reading.id }, cookie: viewer })).status).toBe(403);

    const list = await (await callRoute(h(readingsRoute.GET), { params: { circuitId: id }, cookie: viewer })).json();
    expect(list.readings).toHaveLength(1);
    expect((await callRoute(h(readingRoute.DELETE), { method: "DELETE", params: { readingId: reading.id }, cookie: tech })).status).toBe(204);
    expect((await (await callRoute(h(readingsRoute.GET), { params: { circuitId: id }, cookie: tech })).json()).readings).toHaveLength(0);
  });

  it("exports a circuit with its readings and imports the file into another job unchanged", async () => {
    const exported = await callRoute(h(exportRoute.GET), { params: { circuitId: "cir_demo_unit14_charging" }, cookie: tech });
    expect(exported.status).toBe(200);
    expect(exported.headers.get("content-disposition")).toMatch(/attachment; filename="charging-circuit-v2\.ampwright\.json"/);
    const file = await exported.json();
    expect(file.format).toBe("ampwright.circuit-export/1");
    expect(file.readings.length).toBeGreaterThanOrEqual(6); // the demo's six, and any a browser test added

    const jobId = await newJob(tech, "Imported copy");
    const imported = await callRoute(h(importRoute.POST), { json: file, params: { jobId }, cookie: tech });
    expect(imported.status).toBe(201);
    const body = await imported.json();
    expect(body.circuit.document).toEqual(file.circuit.document);
    expect(body.circuit.version).toBe(1);
    const readings = await (await callRoute(h(readingsRoute.GET), { params: { circuitId: body.circuit.id }, cookie: tech })).json();
    expect(readings.readings.map((r: { value: number }) => r.value)).toEqual(file.readings.map((r: { value: number }) => r.value));
    expect(readings.readings[0].note).toContain("taken by Priya Halvorsen");

    // A bare document is taken too; a reading on a terminal the file's circuit lacks is refused whole.
    expect((await callRoute(h(importRoute.POST), { json: { document: pickupCharging }, params: { jobId }, cookie: tech })).status).toBe(201);
    const before = (await pool.query("select count(*)::int n from circuits where job_id = $1", [jobId])).rows[0].n;
    const wrong = { ...file, readings: [{ ...file.readings[0], positive: "Z9.pos" }] };
    const refused = await callRoute(h(importRoute.POST), { json: wrong, params: { jobId }, cookie: tech });
    expect(refused.status).toBe(422);
    expect((await refused.json()).error.issues[0].path).toBe("readings.0.positive");
    expect((await pool.query("select count(*)::int n from circuits where job_id = $1", [jobId])).rows[0].n).toBe(before);
  });
});

describe("sizings saved to a job", () => {
  it("keeps a sizing with its job, works the answer out on the server, and removes it", async () => {
    const jobId = await newJob(tech, "Winch install");
    // The light bar worked by hand in the sizing page's browser test: 20 A, 6 m one way, 3 % of 12 V, cabin,
    // 105 C (the request default): 6 AWG (NBS Handbook 100 copper) with a 25 A blade fuse (125 %, ISO 8820-3 steps).
    const request = { systemVoltage: 12, currentA: 20, lengthM: 6, zone: "cabin" };
    const saved = await callRoute(h(jobSizings.POST), { json: { title: "Light bar feed", inputs: { current: "20 A", length: "6 m" }, request }, params: { jobId }, cookie: tech });
    expect(saved.status).toBe(201);
    const sizing = (await saved.json()).sizing;
    expect(sizing).toMatchObject({ title: "Light bar feed", inputs: { current: "20 A", length: "6 m" }, createdByName: "Priya Halvorsen" });
    expect(sizing.answer).toMatchObject({ status: "ok", size: "6 AWG", protection: { ratingA: 25, type: "blade" } });
    expect(sizing.answer.limitV).toBeCloseTo(0.36, 12); // 3 % of 12 V, ABYC E-11 critical

    // Anything but the request is ignored for the answer: a caller cannot store an answer of its own.
    const forged = await callRoute(h(jobSizings.POST), { json: { title: "x", request, answer: { size: "20 AWG" } }, params: { jobId }, cookie: tech });
    expect(forged.status).toBe(422);
    const bad = await callRoute(h(jobSizings.POST), { json: { title: " ", inputs: { "bad key": "x" }, request: { ...request, currentA: -1 } }, params: { jobId }, cookie: tech });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["inputs.bad key", "request.currentA", "title"]);
    const count = async () => (await pool.query("select count(*)::int n from sizings where job_id = $1", [jobId])).rows[0].n;
    expect(await count()).toBe(1);

    const list = await (await callRoute(h(jobSizings.GET), { params: { jobId }, cookie: viewer })).json();
    expect(list.sizings.map((s: { id: string }) => s.id)).toEqual([sizing.id]);
    expect((await callRoute(h(sizingRoute.DELETE), { method: "DELETE", params: { sizingId: sizing.id }, cookie: viewer })).status).toBe(403);
    expect((await callRoute(h(sizingRoute.DELETE), { method: "DELETE", params: { sizingId: sizing.id }, cookie: tech })).status).toBe(204);
    expect(await count()).toBe(0);
    expect((await callRoute(h(sizingRoute.GET), { params: { sizingId: sizing.id }, cookie: tech })).status).toBe(404);
  });
});

describe("the OpenAPI document", () => {
  it("lists every work route with its request schema drawn from zod", async () => {
    const doc = await (await callRoute(h(openapi.GET))).json();
    expect(doc.openapi).toBe("3.0.3");
    for (const p of ["/api/v1/jobs", "/api/v1/jobs/{jobId}", "/api/v1/circuits/{circuitId}", "/api/v1/circuits/{circuitId}/restore", "/api/v1/readings/{readingId}", "/api/v1/jobs/{jobId}/import"]) {
      expect(doc.paths[p], p).toBeDefined();
    }
    const put = doc.paths["/api/v1/circuits/{circuitId}"].put;
    expect(put.requestBody.content["application/json"].schema.properties.document.$ref).toBe("#/components/schemas/CircuitDocument");
    expect(doc.components.schemas.CircuitDocument.properties.components.type).toBe("array");
    expect(doc.paths["/api/v1/jobs"].post.requestBody.content["application/json"].schema.properties.title.maxLength).toBe(200);
  });

  it("describes every route handler under app/api/v1, method by method", async () => {
    const doc = await (await callRoute(h(openapi.GET))).json();
    const root = path.resolve("app/api/v1");
    const missing: string[] = [];
    for (const file of readdirSync(root, { recursive: true, encoding: "utf8" }).filter((f) => f.endsWith("route.ts"))) {
      const url = `/api/v1/${path.dirname(file)}`.replace(/\[(\w+)\]/g, "{$1}").replace(/\/\.$/, "");
      if (url === "/api/v1/openapi.json") continue;
      const methods = [...readFileSync(path.join(root, file), "utf8").matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]!.toLowerCase());
      for (const m of methods) if (!doc.paths[url]?.[m]) missing.push(`${m.toUpperCase()} ${url}`);
    }
    expect(missing).toEqual([]);
  });
});
