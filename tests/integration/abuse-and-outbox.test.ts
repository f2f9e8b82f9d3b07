import { spawn, execSync } from "node:child_process";
import net from "node:net";
import path from "node:path";
import { Pool } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { enqueueMail } from "@/db/queries/mail";
import { DEMO_PASSWORD } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { auth } from "@/lib/auth/server";
import { deliverDueMail } from "@/lib/mail/sender";
import { mailsTo } from "../support/maildev";

const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
afterAll(() => pool.end());

const signIn = (email: string, password: string, address: string) =>
  auth.handler(
    new Request(new URL("/api/auth/sign-in/email", base), {
      method: "POST",
      headers: { origin: base, "content-type": "application/json", "x-ampwright-peer": address },
      body: JSON.stringify({ email, password }),
    }),
  );

describe("abuse limits on sign-in", () => {
  it("answers 429 to the sixth wrong password in a minute, while a neighbour at the same address signs in", async () => {
    await seedDemo(process.env.DATABASE_URL);
    const address = `203.0.113.${Math.floor(Math.random() * 200) + 1}`; // TEST-NET-3 documentation range
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await signIn("tobias@larkspur.example", `wrong password ${i}`, address)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    // Even the right password waits out the minute for that address and account...
    expect((await signIn("tobias@larkspur.example", DEMO_PASSWORD, address)).status).toBe(429);
    // ...but another person behind the same router is not blocked.
    expect((await signIn("priya@larkspur.example", DEMO_PASSWORD, address)).status).toBe(200);
  });
});

function portOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect(port, "127.0.0.1");
    s.once("connect", () => (s.destroy(), resolve(true)));
    s.once("error", () => resolve(false));
  });
}
async function waitPort(port: number, open: boolean) {
  for (let i = 0; i < 80; i++) {
    if ((await portOpen(port)) === open) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`port ${port} did not ${open ? "open" : "close"}`);
}

describe("the mail outbox", () => {
  it("keeps a message while the mail server is down and delivers it once when it is back", async () => {
    const smtp = Number(process.env.AMP_SMTP_PORT ?? 2526);
    const web = Number(process.env.AMP_MAIL_WEB_PORT ?? 2581);
    const to = `outbox-${Date.now().toString(36)}@larkspur.test`;
    execSync(`pkill -f "maildev --sm[t]p ${smtp} " || true`); // [t]: the pattern must not match this shell itself
    await waitPort(smtp, false);
    await enqueueMail(db, { to, subject: "Parts are in for unit 14", text: "The alternator for unit 14 has arrived.", kind: "test" });
    expect(await deliverDueMail()).toBe(0);
    const { rows } = await pool.query(`select attempts, sent_at, last_error from mail_outbox where to_address = $1`, [to]);
    expect(rows[0]).toMatchObject({ attempts: 1, sent_at: null });
    expect(rows[0].last_error).toBeTruthy();
    // The catcher comes back, as test.sh started it.
    const child = spawn(path.resolve("node_modules/.bin/maildev"), ["--smtp", String(smtp), "--ip", "127.0.0.1", "--web", String(web), "--web-ip", "127.0.0.1"], { detached: true, stdio: "ignore" });
    child.unref();
    await waitPort(smtp, true);
    await waitPort(web, true);
    for (let i = 0; i < 40 && (await mailsTo(to)).length === 0; i++) {
      await deliverDueMail();
      await new Promise((r) => setTimeout(r, 250));
    }
    await deliverDueMail(); // once more: nothing is sent twice
    expect((await mailsTo(to)).length).toBe(1);
    const after = await pool.query(`select attempts, sent_at from mail_outbox where to_address = $1`, [to]);
    expect(after.rows[0].sent_at).not.toBeNull();
    expect(after.rows[0].attempts).toBe(2);
  });
});
