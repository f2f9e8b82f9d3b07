import { Pool } from "pg";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as attachmentRoute from "@/app/api/v1/attachments/[attachmentId]/route";
import * as completeRoute from "@/app/api/v1/attachments/[attachmentId]/complete/route";
import * as fileRoute from "@/app/api/v1/attachments/[attachmentId]/file/route";
import * as readingsRoute from "@/app/api/v1/circuits/[circuitId]/readings/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as jobAttachments from "@/app/api/v1/jobs/[jobId]/attachments/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { pickupCharging } from "@/db/demo-work";
import { seedDemo } from "@/db/seed";
import { callRoute, removeTestJobs, signInCookie } from "../support/sessions";

// These tests talk to the real object store stand-in (s3rver) that npm test starts on loopback.
type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
let tech = "";
let viewer = "";
let outsider = "";
let jobId = "";
let readingId = "";

type Started = { attachment: { id: string }; upload: { method: string; url: string; headers: Record<string, string> }; complete: string };

async function start(json: Record<string, unknown>, cookie = tech) {
  return callRoute(h(jobAttachments.POST), { json, params: { jobId }, cookie });
}

/** Starts an upload, PUTs the bytes to the presigned URL as a browser would, and finishes it. */
async function upload(fileName: string, bytes: Buffer, contentType: string, extra: Record<string, unknown> = {}) {
  const res = await start({ fileName, contentType, sizeBytes: bytes.length, ...extra });
  expect(res.status).toBe(201);
  const started = (await res.json()) as Started;
  const put = await fetch(started.upload.url, { method: "PUT", headers: started.upload.headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  const done = await callRoute(h(completeRoute.POST), { method: "POST", params: { attachmentId: started.attachment.id }, cookie: tech });
  return { id: started.attachment.id, done, url: started.upload.url };
}

async function photo(width: number, height: number, format: "png" | "jpeg") {
  const img = sharp({ create: { width, height, channels: 3, background: { r: 180, g: 40, b: 30 } } });
  return format === "png" ? img.png().toBuffer() : img.jpeg().toBuffer();
}

function openFile(attachmentId: string, query = "", cookie = tech) {
  return callRoute(h(fileRoute.GET), { path: `/api/v1/attachments/${attachmentId}/file${query}`, params: { attachmentId }, cookie });
}

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  tech = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  viewer = await signInCookie("sam@larkspur.example", DEMO_PASSWORD);
  outsider = await signInCookie("ines@fernmoor.example", DEMO_PASSWORD);
  const job = await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: "Upload check", vehicle: "Test pickup", complaint: "Battery light" }, cookie: tech });
  jobId = (await job.json()).job.id;
  const c = await callRoute(h(jobCircuits.POST), { json: { document: pickupCharging }, params: { jobId }, cookie: tech });
  const circuitId = (await c.json()).circuit.id;
  const r = await callRoute(h(readingsRoute.POST), { json: { stateId: "charge", positive: "B1.neg", negative: "A1.case", value: 0.62, currentA: 40 }, params: { circuitId }, cookie: tech });
  readingId = (await r.json()).reading.id;
});

afterAll(async () => {
  await removeTestJobs(pool);
  await pool.end();
});

describe("photos and files on a job", () => {
  it("keeps a photo of a reading with its thumbnail, and a member can open both", async () => {
    const bytes = await photo(1600, 1200, "jpeg");
    const { id, done } = await upload("meter at the case.jpg", bytes, "image/jpeg", { readingId });
    expect(done.status).toBe(200);
    const { attachment } = await done.json();
    expect(attachment).toMatchObject({ status: "ready", contentType: "image/jpeg", sizeBytes: bytes.length, hasThumbnail: true, readingId });
    expect(attachment.sha256).toMatch(/^[0-9a-f]{64}$/);

    const list = await (await callRoute(h(jobAttachments.GET), { params: { jobId }, cookie: viewer })).json();
    expect(list.attachments.map((a: { id: string }) => a.id)).toContain(id);

    const full = await openFile(id, "", viewer);
    expect(full.status).toBe(302);
    const got = Buffer.from(await (await fetch(full.headers.get("location")!)).arrayBuffer());
    expect(got.equals(bytes)).toBe(true);

    const thumb = await openFile(id, "?variant=thumbnail", viewer);
    expect(thumb.status).toBe(302);
    const thumbBytes = Buffer.from(await (await fetch(thumb.headers.get("location")!)).arrayBuffer());
    const meta = await sharp(thumbBytes).metadata();
    expect(meta.format).toBe("webp");
    // 1600 x 1200 fitted inside 320 px keeps the 4:3 shape: 320 x 240.
    expect([meta.width, meta.height]).toEqual([320, 240]);

    const saved = await openFile(id, "?download=1");
    const res = await fetch(saved.headers.get("location")!);
    expect(res.headers.get("content-disposition")).toContain('attachment; filename="meter at the case.jpg"');
  });

  it("refuses a program renamed to .jpg by reading its bytes, and removes what was uploaded", async () => {
    // The first bytes of an ELF executable (the format of Linux programs), padded out.
    const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(4096, 1)]);
    const { id, done, url } = await upload("photo.jpg", elf, "image/jpeg");
    expect(done.status).toBe(422);
    const body = await done.json();
    expect(body.error.code).toBe("wrong-type");
    expect(body.error.message).toContain("photo.jpg");
    expect((await fetch(url.split("?")[0]!)).status).toBe(404);
    const rows = await pool.query("select 1 from attachments where id = $1", [id]);
    expect(rows.rowCount).toBe(0);
  });

  it("refuses files over 15 MB, whether declared or found after upload", async () => {
    const declared = await start({ fileName: "huge.pdf", contentType: "application/pdf", sizeBytes: 16 * 1024 * 1024 });
    expect(declared.status).toBe(422);
    expect(JSON.stringify(await declared.json())).toContain("15 MB");

    // The declared size said small; the bytes that arrived were 16 MB of a valid PNG header and padding.
    const png = await photo(8, 8, "png");
    const big = Buffer.concat([png, Buffer.alloc(16 * 1024 * 1024 - png.length, 0)]);
    const res = await start({ fileName: "small.png", contentType: "image/png", sizeBytes: 1000 });
    const started = (await res.json()) as Started;
    expect((await fetch(started.upload.url, { method: "PUT", headers: started.upload.headers, body: new Uint8Array(big) })).status).toBe(200);
    const done = await callRoute(h(completeRoute.POST), { method: "POST", params: { attachmentId: started.attachment.id }, cookie: tech });
    expect(done.status).toBe(422);
    expect((await done.json()).error.code).toBe("too-large");
    expect((await fetch(started.upload.url.split("?")[0]!)).status).toBe(404);
  });

  it("says what to fix for a reading from another job, a missing upload, or a type it does not take", async () => {
    const wrongReading = await start({ fileName: "a.png", contentType: "image/png", sizeBytes: 10, readingId: "rdg_nope" });
    expect(wrongReading.status).toBe(422);
    expect(JSON.stringify(await wrongReading.json())).toContain("no such reading");

    const exe = await start({ fileName: "a.exe", contentType: "application/x-msdownload", sizeBytes: 10 });
    expect(exe.status).toBe(422);
    expect(JSON.stringify(await exe.json())).toContain("photo or a PDF");

    const started = (await (await start({ fileName: "later.png", contentType: "image/png", sizeBytes: 10 })).json()) as Started;
    const early = await callRoute(h(completeRoute.POST), { method: "POST", params: { attachmentId: started.attachment.id }, cookie: tech });
    expect(early.status).toBe(409);
    expect((await early.json()).error.message).toContain("upload it");
  });

  it("keeps files from other organisations and from viewers' changes", async () => {
    const { id, done } = await upload("panel.png", await photo(40, 30, "png"), "image/png");
    expect(done.status).toBe(200);
    expect((await openFile(id, "", outsider)).status).toBe(404);
    expect((await callRoute(h(attachmentRoute.GET), { params: { attachmentId: id }, cookie: outsider })).status).toBe(404);
    expect((await start({ fileName: "x.png", contentType: "image/png", sizeBytes: 10 }, viewer)).status).toBe(403);
    expect((await callRoute(h(attachmentRoute.DELETE), { method: "DELETE", params: { attachmentId: id }, cookie: viewer })).status).toBe(403);

    const removed = await callRoute(h(attachmentRoute.DELETE), { method: "DELETE", params: { attachmentId: id }, cookie: tech });
    expect(removed.status).toBe(204);
    expect((await openFile(id)).status).toBe(404);
    const audit = await pool.query("select action from audit_events where entity_id = $1 and action like 'attachment.%' order by id", [jobId]);
    expect(audit.rows.map((r) => r.action)).toContain("attachment.remove");
  });

  it("a replayed upload URL cannot change a checked file: the URL writes a staging key nothing serves", async () => {
    const bytes = await photo(64, 48, "jpeg");
    const { id, done, url } = await upload("checked.jpg", bytes, "image/jpeg");
    expect(done.status).toBe(200);
    const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(2048, 1)]);
    // The stand-in store takes the second PUT (the URL has not expired) ...
    expect((await fetch(url, { method: "PUT", headers: { "content-type": "image/jpeg" }, body: new Uint8Array(elf) })).status).toBe(200);
    // ... finishing again changes nothing, and the file anyone opens is still the checked photo.
    expect((await callRoute(h(completeRoute.POST), { method: "POST", params: { attachmentId: id }, cookie: tech })).status).toBe(200);
    const opened = await openFile(id);
    expect(opened.status).toBe(302);
    const got = Buffer.from(await (await fetch(opened.headers.get("location")!)).arrayBuffer());
    expect(got.equals(bytes)).toBe(true);
    const { rows } = await pool.query("select object_key from attachments where id = $1", [id]);
    expect(rows[0].object_key).toMatch(/^files\//);
    expect(new URL(url).pathname).toContain("/staging/");
  });

  it("refuses a PDF that would run a script or a program, even with its names escaped, and keeps a plain one as a download", async () => {
    const pdf = (body: string) => Buffer.from(`%PDF-1.4\n1 0 obj\n<< /Type /Catalog ${body} >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n`, "latin1");
    for (const [name, body] of [
      ["script.pdf", "/OpenAction << /S /JavaScript /JS (app.alert(1)) >>"],
      ["escaped.pdf", "/OpenAction << /S /J#61vaScript /J#53 (app.alert(1)) >>"],
      ["launch.pdf", "/OpenAction << /S /Launch /F (calc.exe) >>"],
    ] as const) {
      const { id, done } = await upload(name, pdf(body), "application/pdf");
      expect(done.status, name).toBe(422);
      const err = (await done.json()).error;
      expect(err.code).toBe("active-pdf");
      expect(err.message).toContain(name);
      expect((await pool.query("select 1 from attachments where id = $1", [id])).rowCount).toBe(0);
    }
    const plain = pdf("/Pages 2 0 R");
    const { id, done } = await upload("Prüfbericht Batterie.pdf", plain, "application/pdf");
    expect(done.status).toBe(200);
    const res = await openFile(id);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("content-disposition")).toBe(`attachment; filename="Prufbericht Batterie.pdf"; filename*=UTF-8''Pr%C3%BCfbericht%20Batterie.pdf`);
    expect(res.headers.get("content-security-policy")).toContain("sandbox");
    expect(Buffer.from(await res.arrayBuffer()).equals(plain)).toBe(true);
  });

  it("opens photos whose names are not ASCII", async () => {
    const bytes = await photo(32, 24, "png");
    const { id, done } = await upload("Spannung am Anlasser – 9,6 V.png", bytes, "image/png");
    expect(done.status).toBe(200);
    for (const q of ["", "?download=1", "?variant=thumbnail"]) {
      const opened = await openFile(id, q);
      expect(opened.status, q).toBe(302);
      const res = await fetch(opened.headers.get("location")!);
      expect(res.status, q).toBe(200);
      expect(res.headers.get("content-disposition"), q).toContain("filename*=UTF-8''Spannung%20am%20Anlasser%20%E2%80%93%209%2C6%20V.png");
    }
  });
});
