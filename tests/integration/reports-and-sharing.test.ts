import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Papa from "papaparse";
import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as readingsCsv from "@/app/api/v1/circuits/[circuitId]/readings.csv/route";
import * as readingsRoute from "@/app/api/v1/circuits/[circuitId]/readings/route";
import * as resultsCsv from "@/app/api/v1/circuits/[circuitId]/results.csv/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as reportPdf from "@/app/api/v1/jobs/[jobId]/report.pdf/route";
import * as reportEmail from "@/app/api/v1/jobs/[jobId]/report/email/route";
import * as jobRoute from "@/app/api/v1/jobs/[jobId]/route";
import * as jobShares from "@/app/api/v1/jobs/[jobId]/share-links/route";
import * as jobSizings from "@/app/api/v1/jobs/[jobId]/sizings/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import * as shareRoute from "@/app/api/v1/share-links/[linkId]/route";
import * as sharedPdf from "@/app/shared/[token]/report.pdf/route";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { benchTrainer, pickupCharging } from "@/db/demo-work";
import { seedDemo } from "@/db/seed";
import { hashShareToken, newShareToken } from "@/lib/report/tokens";
import { waitForMail } from "../support/maildev";
import { callRoute, removeTestJobs, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
const work = mkdtempSync(path.join(tmpdir(), "ampwright-report-"));
let tech = "";
let viewer = "";
let jobId = "";
let chargingId = "";

/** The PDF's text as poppler's pdftotext reads it (layout kept, so a table row stays on one line). */
function pdfText(pdf: Buffer, name: string): string {
  const file = path.join(work, `${name}.pdf`);
  writeFileSync(file, pdf);
  return execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
}

function openShared(token: string) {
  return (sharedPdf.GET as unknown as Handler)(new Request(`http://127.0.0.1:3100/shared/${token}/report.pdf`), { params: Promise.resolve({ token }) });
}

const tokenOf = (url: string) => url.split("/shared/")[1] as string;

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  tech = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  viewer = await signInCookie("sam@larkspur.example", DEMO_PASSWORD);
  const job = await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: "Report check: battery light", vehicle: "Test pickup", complaint: "Battery light at idle" }, cookie: tech });
  jobId = (await job.json()).job.id;
  const patched = await callRoute(h(jobRoute.PATCH), { method: "PATCH", json: { findings: "Bracket joint high resistance", repair: "Cleaned the bracket and added a strap" }, params: { jobId }, cookie: tech });
  expect(patched.status).toBe(200);
  const c1 = await callRoute(h(jobCircuits.POST), { json: { document: pickupCharging }, params: { jobId }, cookie: tech });
  chargingId = (await c1.json()).circuit.id;
  const c2 = await callRoute(h(jobCircuits.POST), { json: { document: { ...benchTrainer, name: "Second circuit, not shared" } }, params: { jobId }, cookie: tech });
  expect(c2.status).toBe(201);
  for (const r of [
    { stateId: "base", positive: "B1.pos", negative: "B1.neg", value: 12.44, note: "Resting two hours" },
    { stateId: "charge", positive: "B1.neg", negative: "A1.case", value: 1.69, currentA: 49, note: '=HYPERLINK("x") ground side' },
    { stateId: "charge", positive: "GE.t", negative: "A1.case", value: 1.68, currentA: 49, note: "Block to case" },
  ]) {
    expect((await callRoute(h(readingsRoute.POST), { json: r, params: { circuitId: chargingId }, cookie: tech })).status).toBe(201);
  }
  const sizing = { title: "Light bar feed", inputs: { current: "20 A" }, request: { systemVoltage: 12, currentA: 20, lengthM: 6 } };
  expect((await callRoute(h(jobSizings.POST), { json: sizing, params: { jobId }, cookie: tech })).status).toBe(201);
});
afterAll(async () => {
  await removeTestJobs(pool);
  await pool.end();
});

describe("the job report as a PDF", () => {
  it("holds the job, the findings, every reading with its expected value and verdict, the sizing and the cautions", async () => {
    const res = await callRoute(h(reportPdf.GET), { params: { jobId }, cookie: viewer });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toContain("report-check-battery-light-report.pdf");
    const pdf = Buffer.from(await res.arrayBuffer());
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    const text = pdfText(pdf, "job");
    expect(text).toContain("Report check: battery light");
    expect(text).toContain("Bracket joint high resistance");
    expect(text).toContain("Cleaned the bracket and added a strap");
    // The readings as typed, with the model's prediction beside them (the demo pickup circuit, solved by Ampwright).
    expect(text).toMatch(/12\.44 V\s+12\.45 V\s+As predicted/);
    expect(text).toMatch(/1\.69 V at 49 A\s+1\.713 V/);
    expect(text).toContain("Light bar feed");
    expect(text).toContain("Second circuit, not shared");
    expect(text).toContain("Lead-acid batteries vent hydrogen");
    // The resistance along the probes' path, with ohms spelled out (the shipped font has no Greek letters).
    expect(text).toMatch(/W5, JAC, W4: model 35\.0 mohm, reading gives 34\.3 mohm at 49 A/);
  });

  it("renders to an image with poppler (pdftoppm), page by page", () => {
    const file = path.join(work, "job.pdf");
    const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync("pdfinfo", [file], { encoding: "utf8" }))?.[1]);
    expect(pages).toBeGreaterThanOrEqual(2);
    execFileSync("pdftoppm", ["-png", "-r", "50", "-f", "1", "-l", "1", file, path.join(work, "page")]);
    const png = readFileSync(path.join(work, "page-1.png"));
    expect(png.subarray(1, 4).toString()).toBe("PNG");
    expect(statSync(path.join(work, "page-1.png")).size).toBeGreaterThan(10_000);
  });
});

describe("e-mailing the report", () => {
  it("sends the PDF and, when asked, a read-only link that opens the report", async () => {
    const to = `report-${Date.now()}@customer.example`;
    const res = await callRoute(h(reportEmail.POST), { json: { to, message: "Your pickup is ready.", linkDays: 3 }, params: { jobId }, cookie: tech });
    expect(res.status).toBe(202);
    const mail = (await waitForMail(to, /Report: Report check: battery light/)) as Awaited<ReturnType<typeof waitForMail>> & { attachments?: { filename: string; contentType: string }[] };
    expect(mail.text).toContain("Your pickup is ready.");
    expect(mail.text).toMatch(/1\.69 V at 49 A \(expected 1\.713 V\)/);
    expect(mail.attachments?.map((a) => [a.filename, a.contentType])).toEqual([["report-check-battery-light-report.pdf", "application/pdf"]]);
    const token = /\/shared\/([A-Za-z0-9_-]{43})/.exec(mail.text)?.[1];
    expect(token).toBeDefined();
    expect((await openShared(token!)).status).toBe(200);
  });

  it("refuses a bad address with a message that says what to fix, and a viewer may not send", async () => {
    const bad = await callRoute(h(reportEmail.POST), { json: { to: "not an address" }, params: { jobId }, cookie: tech });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0]).toMatchObject({ path: "to", message: expect.stringContaining("e-mail address") });
    expect((await callRoute(h(reportEmail.POST), { json: { to: "x@customer.example" }, params: { jobId }, cookie: viewer })).status).toBe(403);
  });
});

describe("share links", () => {
  it("open without signing in until revoked, then answer 404", async () => {
    const made = await callRoute(h(jobShares.POST), { json: { label: "customer", expiresInDays: 7 }, params: { jobId }, cookie: tech });
    expect(made.status).toBe(201);
    const { link } = await made.json();
    const token = tokenOf(link.url);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const open = await openShared(token);
    expect(open.status).toBe(200);
    expect(open.headers.get("x-robots-tag")).toBe("noindex, nofollow");
    // The token is never stored: only its hash, and the list shows neither.
    const stored = await pool.query("select * from share_links where id = $1", [link.id]);
    expect(JSON.stringify(stored.rows[0])).not.toContain(token);
    expect(stored.rows[0].token_hash).toBe(hashShareToken(token));
    expect(stored.rows[0].open_count).toBe(1);
    const listed = await (await callRoute(h(jobShares.GET), { params: { jobId }, cookie: viewer })).json();
    expect(JSON.stringify(listed)).not.toContain(token);
    expect(JSON.stringify(listed)).not.toContain(stored.rows[0].token_hash);

    expect((await callRoute(h(shareRoute.DELETE), { method: "DELETE", params: { linkId: link.id }, cookie: tech })).status).toBe(200);
    expect((await openShared(token)).status).toBe(404);
  });

  it("answer 404 once expired", async () => {
    const { link } = await (await callRoute(h(jobShares.POST), { json: { expiresInDays: 1 }, params: { jobId }, cookie: tech })).json();
    const token = tokenOf(link.url);
    expect((await openShared(token)).status).toBe(200);
    await pool.query("update share_links set expires_at = now() - interval '1 second' where id = $1", [link.id]);
    expect((await openShared(token)).status).toBe(404);
  });

  it("cannot be guessed from another: a one-character change, the stored hash and a fresh token all fail", async () => {
    const a = await (await callRoute(h(jobShares.POST), { json: {}, params: { jobId }, cookie: tech })).json();
    const b = await (await callRoute(h(jobShares.POST), { json: {}, params: { jobId }, cookie: tech })).json();
    const ta = tokenOf(a.link.url);
    const tb = tokenOf(b.link.url);
    // Two links made one after the other share no leading run beyond chance (64 symbols: 3 alike is 1 in 262,144).
    let common = 0;
    while (ta[common] === tb[common]) common++;
    expect(common).toBeLessThan(3);
    const flipped = ta.slice(0, -1) + (ta.endsWith("A") ? "B" : "A");
    expect((await openShared(flipped)).status).toBe(404);
    expect((await openShared(hashShareToken(ta))).status).toBe(404);
    expect((await openShared(newShareToken())).status).toBe(404);
    expect((await openShared("short")).status).toBe(404);
    // 2,000 fresh tokens: all different, and every symbol position takes most of the 64 symbols.
    const many = Array.from({ length: 2000 }, newShareToken);
    expect(new Set(many).size).toBe(2000);
    for (let i = 0; i < 42; i++) expect(new Set(many.map((t) => t[i])).size).toBeGreaterThan(32);
  });

  it("to one circuit shows that circuit and nothing else of the job", async () => {
    const { link } = await (await callRoute(h(jobShares.POST), { json: { circuitId: chargingId }, params: { jobId }, cookie: tech })).json();
    const res = await openShared(tokenOf(link.url));
    const text = pdfText(Buffer.from(await res.arrayBuffer()), "circuit-only");
    expect(text).toContain("Charging circuit");
    expect(text).toContain("12.44 V");
    expect(text).not.toContain("Second circuit, not shared");
    expect(text).not.toContain("Light bar feed");
    expect(text).not.toContain("Bracket joint high resistance");
  });

  it("refuses a circuit of another job and an expiry out of range, saying what to fix", async () => {
    const other = await callRoute(h(jobShares.POST), { json: { circuitId: "cir_demo_unit14_charging" }, params: { jobId }, cookie: tech });
    expect(other.status).toBe(422);
    expect((await other.json()).error.issues[0]).toMatchObject({ path: "circuitId", message: "this job has no such circuit" });
    const long = await callRoute(h(jobShares.POST), { json: { expiresInDays: 400 }, params: { jobId }, cookie: tech });
    expect((await long.json()).error.issues[0]).toMatchObject({ path: "expiresInDays", message: "a link lasts at most 365 days" });
  });
});

describe("CSV exports", () => {
  it("gives the readings with the model's prediction, and text a spreadsheet would run as a formula made harmless", async () => {
    const res = await callRoute(h(readingsCsv.GET), { params: { circuitId: chargingId }, cookie: viewer });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const parsed = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(3);
    expect(parsed.data[1]).toMatchObject({ state: "charge", red_probe: "B1.neg", black_probe: "A1.case", value: "1.69", current_a: "49", verdict: "as-predicted" });
    expect(Number(parsed.data[1].expected_v)).toBeCloseTo(1.713, 3);
    expect(parsed.data[1].note.startsWith("'=HYPERLINK")).toBe(true);
  });

  it("gives every part and cable in every operating state", async () => {
    const res = await callRoute(h(resultsCsv.GET), { params: { circuitId: chargingId }, cookie: viewer });
    const parsed = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    const states = new Set(parsed.data.map((r) => r.state));
    expect(states).toEqual(new Set(["base", ...(pickupCharging.states ?? []).map((s) => s.id)]));
    const perState = pickupCharging.components.length + pickupCharging.wires.length;
    expect(parsed.data).toHaveLength(perState * states.size);
    expect(parsed.data.find((r) => r.state === "charge" && r.id === "W1")?.type).toBe("cable");
    // Ohm's law in every cable row: drop = current x resistance (the solver's own figures, to rounding).
    for (const r of parsed.data.filter((x) => x.type === "cable")) expect(Number(r.drop_v)).toBeCloseTo(Number(r.current_a) * Number(r.resistance_ohm), 4);
  });
});
