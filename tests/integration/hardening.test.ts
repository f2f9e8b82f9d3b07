import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as authRoute from "@/app/api/auth/[...all]/route";
import * as circuitLesson from "@/app/api/v1/circuits/[circuitId]/lesson/route";
import * as restoreRoute from "@/app/api/v1/circuits/[circuitId]/restore/route";
import * as readingsRoute from "@/app/api/v1/circuits/[circuitId]/readings/route";
import * as readingRoute from "@/app/api/v1/readings/[readingId]/route";
import * as acceptRoute from "@/app/api/v1/invitations/[invitationId]/accept/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import * as invitations from "@/app/api/v1/organizations/[orgId]/invitations/route";
import * as orgs from "@/app/api/v1/organizations/route";
import { DEMO_PASSWORD, demoClass, demoShop } from "@/db/demo";
import { benchTrainer, pickupCharging } from "@/db/demo-work";
import { INVITATION_LIMITS } from "@/db/queries/invitations";
import { seedDemo } from "@/db/seed";
import { ACCOUNT_FAILURES } from "@/lib/auth/abuse";
import { firstLink, mailsTo, waitForMail } from "../support/maildev";
import { callRoute, removeTestJobs, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
let octet = 0;
/** A documentation-range address (RFC 5737 TEST-NET-2) of its own for each call that needs one. */
const address = () => `198.18.${Math.floor(Math.random() * 200) + 20}.${(octet = (octet % 250) + 1)}`;

/** Calls better-auth through Ampwright's own route (app/api/auth), as the browser does. */
function authCall(path: string, init: { method?: "GET" | "POST"; json?: unknown; cookie?: string; headers?: Record<string, string> } = {}) {
  const method = init.method ?? (init.json !== undefined ? "POST" : "GET");
  const req = new Request(new URL(`/api/auth${path}`, base), {
    method,
    headers: { origin: base, "content-type": "application/json", "x-ampwright-peer": address(), ...(init.cookie ? { cookie: init.cookie } : {}), ...init.headers },
    body: init.json !== undefined ? JSON.stringify(init.json) : undefined,
  });
  return method === "GET" ? authRoute.GET(req) : authRoute.POST(req);
}

const cookieOf = (res: Response) =>
  res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");

/** A new confirmed account, signed in; answers its address, password and cookie. */
async function newAccount(name = "Hollis Brede") {
  const email = `hardening-${unique()}@larkspur.test`;
  const password = "hardening password 7";
  expect((await authCall("/sign-up/email", { json: { name, email, password } })).status).toBe(200);
  await pool.query(`update "user" set email_verified = true where email = $1`, [email]);
  const res = await authCall("/sign-in/email", { json: { email, password } });
  expect(res.status).toBe(200);
  return { email, password, cookie: cookieOf(res) };
}

const counts = async () =>
  (
    await pool.query(
      "select (select count(*) from jobs)::int j, (select count(*) from circuits)::int c, (select count(*) from readings)::int r, (select count(*) from invitation)::int i, (select count(*) from lessons)::int l",
    )
  ).rows[0];

let tech = "";
let lead = "";
beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  tech = await signInCookie("priya@larkspur.example", DEMO_PASSWORD);
  lead = await signInCookie("tobias@larkspur.example", DEMO_PASSWORD);
});
afterAll(async () => {
  await removeTestJobs(pool);
  await pool.end();
});

describe("who is calling: the socket's address, never the client's own word", () => {
  it("meets 429 at the sixth wrong password even when X-Forwarded-For changes on every try", async () => {
    const { email } = await newAccount();
    const peer = address();
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const res = await authCall("/sign-in/email", { json: { email, password: `wrong ${i}` }, headers: { "x-ampwright-peer": peer, "x-forwarded-for": `203.0.113.${i + 1}` } });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it("locks an account after wrong passwords from many addresses, and tells its owner by e-mail", async () => {
    const { email, password } = await newAccount("Marit Olsgaard");
    for (let i = 0; i < ACCOUNT_FAILURES.max; i++) {
      expect((await authCall("/sign-in/email", { json: { email, password: `wrong guess ${i}` } })).status).toBe(401);
    }
    // The right password from yet another address waits out the cool-down too.
    const locked = await authCall("/sign-in/email", { json: { email, password } });
    expect(locked.status).toBe(429);
    expect((await locked.json()).message).toMatch(/locked for 15 minutes/);
    const mail = await waitForMail(email, /Sign-in to your Ampwright account is paused/);
    expect(mail.text).toMatch(new RegExp(`wrong password ${ACCOUNT_FAILURES.max} times`));
    expect(mail.text).toMatch(/\/forgot-password/);
  });

  it("caps one address across many e-mail addresses", async () => {
    const peer = address();
    const statuses: number[] = [];
    for (let i = 0; i < 61; i++) {
      statuses.push((await authCall("/sign-in/email", { json: { email: `nobody-${i}-${unique()}@larkspur.test`, password: "not this one" }, headers: { "x-ampwright-peer": peer } })).status);
    }
    expect(statuses.slice(0, 60).every((s) => s === 401)).toBe(true);
    expect(statuses[60]).toBe(429);
  });
});

describe("sessions end when they should", () => {
  it("a password reset ends every other session of the account", async () => {
    const { email, password, cookie } = await newAccount();
    const second = cookieOf(await authCall("/sign-in/email", { json: { email, password } }));
    expect((await callRoute(h(orgs.GET), { cookie })).status).toBe(200);
    expect((await callRoute(h(orgs.GET), { cookie: second })).status).toBe(200);
    expect((await authCall("/request-password-reset", { json: { email, redirectTo: "/reset-password" } })).status).toBe(200);
    const link = firstLink((await waitForMail(email, /Reset your Ampwright password/)).text);
    const token = new URL(link).pathname.split("/").pop()!;
    expect((await authCall("/reset-password", { json: { newPassword: "a brand new password 9", token } })).status).toBe(200);
    expect((await callRoute(h(orgs.GET), { cookie })).status).toBe(401);
    expect((await callRoute(h(orgs.GET), { cookie: second })).status).toBe(401);
  });

  it("signing out ends that cookie at once (no cache lets it work a moment longer)", async () => {
    const { cookie } = await newAccount();
    expect((await callRoute(h(orgs.GET), { cookie })).status).toBe(200);
    expect((await authCall("/sign-out", { method: "POST", json: {}, cookie })).status).toBe(200);
    expect((await callRoute(h(orgs.GET), { cookie })).status).toBe(401);
  });

  it("a password change ends the other sessions even when the request asks to keep them", async () => {
    const { email, password, cookie } = await newAccount();
    const other = cookieOf(await authCall("/sign-in/email", { json: { email, password } }));
    const res = await authCall("/change-password", { json: { currentPassword: password, newPassword: "changed password 11", revokeOtherSessions: false }, cookie });
    expect(res.status).toBe(200);
    expect((await callRoute(h(orgs.GET), { cookie: other })).status).toBe(401);
  });
});

describe("links that would leave the site", () => {
  it("refuses a sign-up whose confirmation would lead to another site", async () => {
    for (const callbackURL of ["//elsewhere.invalid/x", "https://elsewhere.invalid/", "/\\elsewhere.invalid"]) {
      const res = await authCall("/sign-up/email", { json: { name: "Away Link", email: `away-${unique()}@larkspur.test`, password: "away password 12", callbackURL } });
      expect(res.status, callbackURL).toBe(422);
    }
    const ok = await authCall("/sign-up/email", { json: { name: "Home Link", email: `home-${unique()}@larkspur.test`, password: "home password 12", callbackURL: "/invitations/inv_x" } });
    expect(ok.status).toBe(200);
  });
});

describe("better-auth's own routes", () => {
  it("answers 404 on its organisation routes, signed in or not, so they reveal nothing", async () => {
    const student = await signInCookie("ines@fernmoor.example", DEMO_PASSWORD);
    for (const cookie of [student, tech, undefined]) {
      for (const [method, path] of [
        ["GET", `/organization/get-full-organization?organizationId=${demoShop.id}`],
        ["GET", "/organization/list-members"],
        ["POST", "/organization/set-active"],
        ["POST", "/organization/check-slug"],
        ["GET", "/organization/list"],
        ["POST", "/organization/create"],
      ] as const) {
        const res = await authCall(path, { method, cookie, json: method === "POST" ? { organizationId: demoShop.id, slug: "larkspur" } : undefined });
        expect(res.status, `${method} ${path}`).toBe(404);
      }
    }
  });
});

describe("writes from other sites", () => {
  const post = (headers: Record<string, string>, body: string) =>
    (jobsRoute.POST as unknown as Handler)(new Request(new URL("/api/v1/jobs", base), { method: "POST", headers: { cookie: tech, ...headers }, body }), { params: Promise.resolve({}) });
  const job = JSON.stringify({ organizationId: demoShop.id, title: "Forged job" });

  it("refuses another origin, a missing origin, and a body that does not say it is JSON, changing nothing", async () => {
    const before = await counts();
    const cases: [Record<string, string>, number, string][] = [
      [{ origin: "http://127.0.0.1:3101", "content-type": "text/plain" }, 403, "cross-site"],
      [{ origin: "http://evil.invalid", "content-type": "application/json" }, 403, "cross-site"],
      [{ "sec-fetch-site": "same-site", "content-type": "application/json" }, 403, "cross-site"],
      [{ "content-type": "application/json" }, 403, "cross-site"],
      [{ origin: base, "content-type": "text/plain" }, 415, "unsupported-media-type"],
      [{ origin: base, "content-type": "application/x-www-form-urlencoded" }, 415, "unsupported-media-type"],
      [{ origin: base }, 415, "unsupported-media-type"],
    ];
    for (const [headers, status, code] of cases) {
      const res = await post(headers, job);
      expect(res.status, JSON.stringify(headers)).toBe(status);
      expect((await res.json()).error.code).toBe(code);
    }
    expect(await counts()).toEqual(before);
    // The same request from the app's own page goes through.
    expect((await post({ origin: base, "content-type": "application/json; charset=utf-8" }, job)).status).toBe(201);
    expect((await post({ "sec-fetch-site": "same-origin", "content-type": "application/json" }, job)).status).toBe(201);
  });
});

describe("text and numbers at the edge", () => {
  let circuitId = "";
  let jobId = "";
  beforeAll(async () => {
    jobId = (await (await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: "Edge inputs" }, cookie: tech })).json()).job.id;
    circuitId = (await (await callRoute(h(jobCircuits.POST), { json: { document: pickupCharging }, params: { jobId }, cookie: tech })).json()).circuit.id;
  });

  it("refuses NUL characters and lone surrogates in bodies, ids and queries with 400 and the field", async () => {
    const before = await counts();
    const raw = (body: string) =>
      (jobsRoute.POST as unknown as Handler)(new Request(new URL("/api/v1/jobs", base), { method: "POST", headers: { origin: base, cookie: tech, "content-type": "application/json" }, body }), { params: Promise.resolve({}) });
    for (const body of ['{"title":"Bad\\u0000title"}', '{"title":"Half \\ud83d pair"}', '{"title":"Trailing \\udc00"}', '{"tit\\u0000le":"x"}']) {
      const res = await raw(body);
      expect(res.status, body).toBe(400);
      const err = (await res.json()).error;
      expect(err.code).toBe("bad-text");
      expect(err.message).toMatch(/NUL|broken character/);
    }
    const byId = await callRoute(h(readingsRoute.GET), { params: { circuitId: "cir_\u0000x" }, cookie: tech });
    expect(byId.status).toBe(400);
    const byQuery = await callRoute(h(jobsRoute.GET), { path: "/api/v1/jobs?q=%00", cookie: tech });
    expect(byQuery.status).toBe(400);
    expect(await counts()).toEqual(before);
    // A whole pair (an emoji) is ordinary text.
    expect((await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: "Winch 🔋 feed" }, cookie: tech })).status).toBe(201);
  });

  it("answers 422 for a version beyond PostgreSQL's integers and for reading times that cannot be right", async () => {
    const before = await counts();
    const restore = await callRoute(h(restoreRoute.POST), { json: { version: 2 ** 31 }, params: { circuitId }, cookie: tech });
    expect(restore.status).toBe(422);
    for (const takenAt of ["0000-01-01T00:00:00Z", "9999-12-31T23:59:59-14:00", "1999-12-31T23:00:00Z"]) {
      const res = await callRoute(h(readingsRoute.POST), { json: { positive: "B1.pos", negative: "B1.neg", value: 12.5, takenAt }, params: { circuitId }, cookie: tech });
      expect(res.status, takenAt).toBe(422);
      expect((await res.json()).error.issues[0].path).toBe("takenAt");
    }
    expect(await counts()).toEqual(before);
  });

  it("answers 422 for crafted cursors, and pages by date to the end without repeating a row", async () => {
    const crafted = [
      Buffer.from(JSON.stringify(["not a date", "job_x"])).toString("base64url"),
      Buffer.from(JSON.stringify(["2026-01-01T00:00:00Z", "job_\u0000"])).toString("base64url"),
      Buffer.from(JSON.stringify([1, 2])).toString("base64url"),
      "!!!",
    ];
    for (const cursor of crafted) {
      const res = await callRoute(h(jobsRoute.GET), { path: `/api/v1/jobs?organizationId=${demoShop.id}&sort=created&dir=asc&cursor=${encodeURIComponent(cursor)}`, cookie: tech });
      expect(res.status, cursor).toBe(422);
    }
    // Several jobs made within one millisecond would repeat for ever with a cursor kept in milliseconds.
    for (let i = 0; i < 5; i++) await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: `Paging ${i}` }, cookie: tech });
    await pool.query(`update jobs set created_at = date_trunc('milliseconds', now()) + (random() * interval '900 microseconds') where title like 'Paging %'`);
    for (const dir of ["asc", "desc"]) {
      const seen: string[] = [];
      let cursor: string | null = null;
      for (let page = 0; page < 100; page++) {
        const q: string = `/api/v1/jobs?organizationId=${demoShop.id}&sort=created&dir=${dir}&limit=2${cursor ? `&cursor=${cursor}` : ""}`;
        const body = await (await callRoute(h(jobsRoute.GET), { path: q, cookie: tech })).json();
        seen.push(...body.jobs.map((j: { id: string }) => j.id));
        cursor = body.nextCursor;
        if (!cursor) break;
      }
      expect(cursor, `paging ${dir} ended`).toBeNull();
      expect(new Set(seen).size, `no repeats ${dir}`).toBe(seen.length);
      const { rows } = await pool.query("select count(*)::int n from jobs where organization_id = $1", [demoShop.id]);
      expect(seen.length, `every job once ${dir}`).toBe(rows[0].n);
    }
  });
});

describe("readings that cannot be true are refused, and nothing is saved", () => {
  it("answers 422 in words for 520 V at rest, a swapped battery reading, and the same on a correction", async () => {
    const jobId = (await (await callRoute(h(jobsRoute.POST), { json: { organizationId: demoShop.id, title: "Implausible readings" }, cookie: tech })).json()).job.id;
    const circuitId = (await (await callRoute(h(jobCircuits.POST), { json: { document: pickupCharging }, params: { jobId }, cookie: tech })).json()).circuit.id;
    const before = await counts();
    const high = await callRoute(h(readingsRoute.POST), { json: { positive: "B1.pos", negative: "B1.neg", value: 520 }, params: { circuitId }, cookie: tech });
    expect(high.status).toBe(422);
    const err = (await high.json()).error;
    expect(err.code).toBe("implausible-reading");
    expect(err.message).toMatch(/Nothing was saved: 520 V is more than a 12 V system can show.*520 mV/);
    const swapped = await callRoute(h(readingsRoute.POST), { json: { positive: "B1.pos", negative: "B1.neg", value: "-12,6" }, params: { circuitId }, cookie: tech });
    expect(swapped.status).toBe(422);
    expect(await counts()).toEqual(before);
    // A good one is kept (a decimal comma read as a decimal mark), and a correction to nonsense is refused.
    const ok = await callRoute(h(readingsRoute.POST), { json: { positive: "B1.pos", negative: "B1.neg", value: "12,45" }, params: { circuitId }, cookie: tech });
    expect(ok.status).toBe(201);
    const saved = (await ok.json()).reading;
    expect(saved.value).toBe(12.45);
    const fix = await callRoute(h(readingRoute.PATCH), { method: "PATCH", json: { value: 1245 }, params: { readingId: saved.id }, cookie: tech });
    expect(fix.status).toBe(422);
    expect((await fix.json()).error.message).toMatch(/Nothing was changed/);
  });
});

describe("actions that happen once", () => {
  it("publishing one circuit twice at once makes one lesson with two versions", async () => {
    const lena = await signInCookie("lena@fernmoor.example", DEMO_PASSWORD);
    const jobId = (await (await callRoute(h(jobsRoute.POST), { json: { organizationId: demoClass.id, title: "Twice published" }, cookie: lena })).json()).job.id;
    const circuitId = (await (await callRoute(h(jobCircuits.POST), { json: { document: benchTrainer }, params: { jobId }, cookie: lena })).json()).circuit.id;
    const both = await Promise.all([0, 1].map(() => callRoute(h(circuitLesson.POST), { json: { title: "Twice at once" }, params: { circuitId }, cookie: lena })));
    expect(both.map((r) => r.status).sort()).toEqual([200, 201]);
    const { rows } = await pool.query("select l.id, l.latest_version, (select count(*)::int from lesson_versions v where v.lesson_id = l.id) n from lessons l where l.source_circuit_id = $1", [circuitId]);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ latest_version: 2, n: 2 });
    await pool.query("delete from lessons where id = $1", [rows[0].id]);
  });

  it("accepting one invitation twice at once adds one member", async () => {
    const { email, cookie } = await newAccount("Ansel Kirkby");
    const created = await (await callRoute(h(invitations.POST), { json: { email, role: "viewer" }, params: { orgId: demoShop.id }, cookie: lead })).json();
    const both = await Promise.all([0, 1].map(() => callRoute(h(acceptRoute.POST), { method: "POST", params: { invitationId: created.invitation.id }, cookie })));
    expect(both.map((r) => r.status)).toEqual([200, 200]);
    const { rows } = await pool.query(`select count(*)::int n from member m join "user" u on u.id = m.user_id where u.email = $1 and m.organization_id = $2`, [email, demoShop.id]);
    expect(rows[0].n).toBe(1);
  });
});

describe("invitation mail cannot be used as a mailer", () => {
  it("refuses a second invitation while one to that address waits", async () => {
    const email = `waiting-${unique()}@elsewhere.test`;
    expect((await callRoute(h(invitations.POST), { json: { email, role: "viewer" }, params: { orgId: demoShop.id }, cookie: lead })).status).toBe(201);
    const again = await callRoute(h(invitations.POST), { json: { email: email.toUpperCase(), role: "technician" }, params: { orgId: demoShop.id }, cookie: lead });
    expect(again.status).toBe(409);
    expect((await again.json()).error.code).toBe("already-invited");
    await waitForMail(email, /Join/);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailsTo(email)).toHaveLength(1);
  });

  it("limits invitations a day per sender and per recipient, sending nothing past them", async () => {
    const sender = await newAccount("Busy Sender");
    const orgId = (await (await callRoute(h(orgs.POST), { json: { name: "Limits garage", kind: "shop" }, cookie: sender.cookie })).json()).organization.id;
    const { rows } = await pool.query(`select id from "user" where email = $1`, [sender.email]);
    await pool.query(
      `insert into invitation (id, organization_id, email, role, status, expires_at, created_at, inviter_id)
       select 'inv_limit_' || g || '_' || $3, $1, 'filler' || g || '-' || $3 || '@elsewhere.test', 'viewer', 'canceled', now() + interval '7 days', now(), $2 from generate_series(1, $4::int) g`,
      [orgId, rows[0].id, unique(), INVITATION_LIMITS.perSenderPerDay],
    );
    const over = `over-${unique()}@elsewhere.test`;
    const res = await callRoute(h(invitations.POST), { json: { email: over, role: "viewer" }, params: { orgId }, cookie: sender.cookie });
    expect(res.status).toBe(429);
    expect((await res.json()).error.message).toMatch(/you have sent 20 in the last 24 hours/);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await mailsTo(over)).toHaveLength(0);

    // One recipient: three invitations a day from anywhere, then no more.
    const target = `popular-${unique()}@elsewhere.test`;
    for (let i = 0; i < INVITATION_LIMITS.perRecipientPerDay; i++) {
      const org = (await (await callRoute(h(orgs.POST), { json: { name: `Recipient garage ${i}`, kind: "shop" }, cookie: tech })).json()).organization.id;
      expect((await callRoute(h(invitations.POST), { json: { email: target, role: "viewer" }, params: { orgId: org }, cookie: tech })).status).toBe(201);
    }
    const fourth = (await (await callRoute(h(orgs.POST), { json: { name: "Recipient garage 4", kind: "shop" }, cookie: tech })).json()).organization.id;
    expect((await callRoute(h(invitations.POST), { json: { email: target, role: "viewer" }, params: { orgId: fourth }, cookie: tech })).status).toBe(429);
  });

  it("writes an organisation's name into the mail as plain text with its links made inert", async () => {
    const owner = await newAccount("Name Tester");
    const name = "Visit https://prizes.example.com/claim now";
    const orgId = (await (await callRoute(h(orgs.POST), { json: { name, kind: "shop" }, cookie: owner.cookie })).json()).organization.id;
    const to = `named-${unique()}@elsewhere.test`;
    expect((await callRoute(h(invitations.POST), { json: { email: to, role: "viewer" }, params: { orgId }, cookie: owner.cookie })).status).toBe(201);
    const mail = await waitForMail(to, /Join/);
    expect(mail.subject).toContain("prizes[.]example[.]com/claim");
    expect(mail.subject).not.toMatch(/https?:|prizes\.example/);
    expect(mail.text).not.toMatch(/prizes\.example/);
  });
});
