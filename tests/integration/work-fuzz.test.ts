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
