import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as circuitRoute from "@/app/api/v1/circuits/[circuitId]/route";
import * as readingsRoute from "@/app/api/v1/circuits/[circuitId]/readings/route";
import * as restoreRoute from "@/app/api/v1/circuits/[circuitId]/restore/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as importRoute from "@/app/api/v1/jobs/[jobId]/import/route";
import * as jobRoute from "@/app/api/v1/jobs/[jobId]/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import * as readingRoute from "@/app/api/v1/readings/[readingId]/route";
import * as jobSizings from "@/app/api/v1/jobs/[jobId]/sizings/route";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { pickupCharging } from "@/db/demo-work";
import { seedDemo } from "@/db/seed";
import { removeTestJobs, signInCookie } from "../support/sessions";

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
let cookie = "";
let jobId = "";
let circuitId = "";
let readingId = "";

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  cookie = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  const call = (h: unknown, body: unknown, params: Record<string, string>) => send(h as Handler, "POST", JSON.stringify(body), params);
  jobId = (await (await call(jobsRoute.POST, { organizationId: demoShop.id, title: "Fuzz target" }, {})).json()).job.id;
  circuitId = (await (await call(jobCircuits.POST, { document: pickupCharging }, { jobId })).json()).circuit.id;
  readingId = (await (await call(readingsRoute.POST, { positive: "B1.pos", negative: "B1.neg", value: 12.5 }, { circuitId })).json()).reading.id;
});
afterAll(async () => {
  await removeTestJobs(pool);
  await pool.end();
});

function send(handler: Handler, method: string, body: string, params: Record<string, string>, ifMatch?: string) {
  const req = new Request("http://127.0.0.1:3100/api/v1/fuzz", {
    method,
    headers: { origin: process.env.APP_URL ?? "http://127.0.0.1:3100", "content-type": "application/json", cookie, ...(ifMatch !== undefined ? { "if-match": ifMatch } : {}) },
    body,
  });
  return handler(req, { params: Promise.resolve(params) });
}

async function counts() {
  const { rows } = await pool.query(
    "select (select count(*) from jobs)::int j, (select count(*) from circuits)::int c, (select count(*) from circuit_revisions)::int r, (select count(*) from readings)::int d, (select count(*) from sizings)::int s, (select count(*) from audit_events)::int a",
  );
  return rows[0];
}

// Bodies from anything at all to near misses of valid ones: wrong types, unknown fields, broken documents.
const nearValid = fc.record(
  {
    title: fc.oneof(fc.string(), fc.integer(), fc.constant(null)),
    status: fc.oneof(fc.constantFrom("open", "closed", "fixed", ""), fc.integer()),
    systemVoltage: fc.oneof(fc.double(), fc.string(), fc.constant(Number.MAX_VALUE)),
    name: fc.oneof(fc.string(), fc.integer()),
    version: fc.oneof(fc.integer(), fc.double(), fc.string()),
    document: fc.oneof(
      fc.anything(),
      fc.constant({ ...pickupCharging, components: "none" }),
      fc.constant({ ...pickupCharging, schema: "ampwright.circuit/99" }),
      fc.constant({ ...pickupCharging, wires: [{ id: "W1", from: "B1.pos", to: "nowhere" }] }),
    ),
    positive: fc.oneof(fc.constantFrom("B1.pos", "Z9.pos", "B1", ""), fc.string()),
    negative: fc.oneof(fc.constantFrom("B1.neg", "B1.pos"), fc.string()),
    value: fc.oneof(fc.double(), fc.string(), fc.constant(1e9)),
    unit: fc.oneof(fc.constantFrom("V", "mV", "kV"), fc.integer()),
    stateId: fc.oneof(fc.constantFrom("base", "charge", "nope"), fc.integer()),
    takenAt: fc.oneof(fc.constantFrom("yesterday", "2026-13-45T00:00:00Z"), fc.string()),
    inputs: fc.oneof(fc.dictionary(fc.string(), fc.string()), fc.constant({ current: "20 A" }), fc.anything()),
    request: fc.oneof(
      fc.anything(),
      fc.constant({ systemVoltage: 12, currentA: 20, lengthM: 6 }),
      fc.record({ systemVoltage: fc.oneof(fc.double(), fc.string()), currentA: fc.double(), lengthM: fc.double(), duty: fc.anything() }, { requiredKeys: [] }),
    ),
    extra: fc.anything(),
  },
  { requiredKeys: [] },
);
const body = fc.oneof(
  nearValid.map((b) => JSON.stringify(b)),
  fc.jsonValue().map((v) => JSON.stringify(v)),
  fc.string(),
  fc.constantFrom("", "{", "[]", "null", '{"a":'),
);

const routes: { name: string; handler: unknown; method: string; params: () => Record<string, string>; ifMatch?: fc.Arbitrary<string | undefined> }[] = [
  { name: "POST /jobs", handler: jobsRoute.POST, method: "POST", params: () => ({}) },
  { name: "PATCH /jobs/:id", handler: jobRoute.PATCH, method: "PATCH", params: () => ({ jobId }) },
  { name: "POST /jobs/:id/circuits", handler: jobCircuits.POST, method: "POST", params: () => ({ jobId }) },
  { name: "POST /jobs/:id/import", handler: importRoute.POST, method: "POST", params: () => ({ jobId }) },
  { name: "PUT /circuits/:id", handler: circuitRoute.PUT, method: "PUT", params: () => ({ circuitId }), ifMatch: fc.oneof(fc.constant(undefined), fc.constantFrom('"1"', '"999"', "*", "W/1"), fc.string()) },
  { name: "POST /circuits/:id/restore", handler: restoreRoute.POST, method: "POST", params: () => ({ circuitId }) },
  { name: "POST /circuits/:id/readings", handler: readingsRoute.POST, method: "POST", params: () => ({ circuitId }) },
  { name: "PATCH /readings/:id", handler: readingRoute.PATCH, method: "PATCH", params: () => ({ readingId }) },
  { name: "POST /jobs/:id/sizings", handler: jobSizings.POST, method: "POST", params: () => ({ jobId }) },
];

describe("random bodies to every write route", () => {
  for (const r of routes) {
    it(`${r.name}: never a 5xx, and nothing changes when a request is refused`, async () => {
      await fc.assert(
        fc.asyncProperty(body, r.ifMatch ?? fc.constant(undefined), async (b, ifMatch) => {
          const before = await counts();
          const res = await send(r.handler as Handler, r.method, b, r.params(), ifMatch);
          expect(res.status, b.slice(0, 200)).toBeLessThan(500);
          if (res.status >= 400) {
            const err = await res.json();
            expect(typeof err.error.message).toBe("string");
            expect(await counts()).toEqual(before);
          }
        }),
        { numRuns: 60, seed: 20261202 },
      );
    });
  }
});

/** Every route module under app/api/v1, with the names of its path parameters. */
function allRoutes(): { file: string; params: string[] }[] {
  const root = path.resolve("app/api/v1");
  const out: { file: string; params: string[] }[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name === "route.ts") out.push({ file: p, params: [...path.relative(root, p).matchAll(/\[(\w+)\]/g)].map((m) => m[1]) });
    }
  };
  walk(root);
  return out;
}

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

describe("every route, every method: characters that cannot be stored and numbers past their columns", () => {
  it("answers 400 to a NUL or broken character in a path id, a query value or a body, and changes nothing", async () => {
    const before = await counts();
    let calls = 0;
    for (const { file, params } of allRoutes()) {
      const mod = (await import(file)) as Record<string, unknown>;
      for (const method of METHODS) {
        const handler = mod[method] as Handler | undefined;
        if (!handler) continue;
        const where = `${method} ${path.relative("app/api/v1", file)}`;
        const writes = method !== "GET";
        const call = (query: string, ids: Record<string, string>, body?: string) =>
          handler(
            new Request(`http://127.0.0.1:3100/api/v1/fuzz${query}`, {
              method,
              headers: { origin: "http://127.0.0.1:3100", "content-type": "application/json", cookie },
              body: writes ? (body ?? "{}") : undefined,
            }),
            { params: Promise.resolve(ids) },
          );
        for (const bad of ["id\u0000x", "id\ud800x"]) {
          if (params.length) {
            const res = await call("", Object.fromEntries(params.map((p) => [p, bad])));
            expect(res.status, `${where} with a bad id`).toBe(400);
            calls++;
          }
          const ids = Object.fromEntries(params.map((p) => [p, "nope"]));
          // In a URL a NUL arrives as %00; a broken character cannot (URL parsing turns its bytes into U+FFFD).
          const q = await call(bad.includes("\u0000") ? "?q=%00" : "?q=%ED%A0%80", ids);
          if (bad.includes("\u0000")) expect(q.status, `${where} with a NUL in the query`).toBe(400);
          else expect(q.status, `${where} with undecodable bytes in the query`).toBeLessThan(500);
          calls++;
          if (writes) {
            const b = await call("", ids, JSON.stringify({ title: bad, name: bad, note: bad, document: { name: bad } }));
            expect(b.status, `${where} with a bad body`).toBeLessThan(500);
            calls++;
          }
        }
      }
    }
    expect(calls).toBeGreaterThan(100);
    expect(await counts()).toEqual(before);
  });

  it("answers 422, never 500, to integers past PostgreSQL's and dates it cannot store", async () => {
    const before = await counts();
    const huge = [2 ** 31, 2 ** 53, 1e300, -(2 ** 31) - 1];
    for (const version of huge) {
      const res = await send(restoreRoute.POST as unknown as Handler, "POST", JSON.stringify({ version }), { circuitId });
      expect(res.status, String(version)).toBe(422);
    }
    const list = await jobsRoute.GET(
      new Request("http://127.0.0.1:3100/api/v1/jobs?limit=99999999999999999999", { headers: { cookie } }) as never,
      { params: Promise.resolve({}) } as never,
    );
    expect(list.status).toBe(422);
    for (const takenAt of ["0000-01-01T00:00:00Z", "9999-12-31T23:59:59Z", "+275760-09-13T00:00:00Z", "2026-02-30T00:00:00Z"]) {
      const res = await send(readingRoute.PATCH as unknown as Handler, "PATCH", JSON.stringify({ takenAt }), { readingId });
      expect(res.status, takenAt).toBe(422);
    }
    expect(await counts()).toEqual(before);
  });
});
