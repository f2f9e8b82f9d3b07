import { Pool } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { auth } from "@/lib/auth/server";
import { firstLink, waitForMail } from "../support/maildev";

const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
afterAll(() => pool.end());

function call(path: string, init: { method?: string; json?: unknown; cookie?: string } = {}) {
  return auth.handler(
    new Request(new URL(path, base), {
      method: init.method ?? (init.json ? "POST" : "GET"),
      headers: { origin: base, "content-type": "application/json", ...(init.cookie ? { cookie: init.cookie } : {}) },
      body: init.json ? JSON.stringify(init.json) : undefined,
    }),
  );
}

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

describe("sign-up, confirmation and sign-in", () => {
  const email = `tech-${unique()}@larkspur.test`;
  const password = "correct horse 42";

  it("signs up, gives the user a personal shop they own, and sends a confirmation mail", async () => {
    const res = await call("/api/auth/sign-up/email", { json: { name: "Robin Tamsett", email, password } });
    expect(res.status).toBe(200);
    const { rows } = await pool.query(
      `select o.kind, m.role from "user" u join member m on m.user_id = u.id join organization o on o.id = m.organization_id where u.email = $1`,
      [email],
    );
    expect(rows).toEqual([{ kind: "shop", role: "owner" }]);
    const mail = await waitForMail(email, /Confirm your e-mail/);
    expect(mail.text).toMatch(/verify-email\?token=/);
  });

  it("refuses sign-in until the address is confirmed", async () => {
    const res = await call("/api/auth/sign-in/email", { json: { email, password } });
    expect(res.status).toBe(403);
  });

  it("confirms the address through the mailed link, then signs in", async () => {
    const mail = await waitForMail(email, /Confirm your e-mail/);
    const link = new URL(firstLink(mail.text));
    const res = await call(link.pathname + link.search);
    expect([200, 302]).toContain(res.status);
    const { rows } = await pool.query(`select email_verified from "user" where email = $1`, [email]);
    expect(rows[0].email_verified).toBe(true);
    const signIn = await call("/api/auth/sign-in/email", { json: { email, password } });
    expect(signIn.status).toBe(200);
    expect(signIn.headers.get("set-cookie")).toMatch(/session_token/);
  });

  it("refuses a wrong password without saying whether the address exists", async () => {
    const res = await call("/api/auth/sign-in/email", { json: { email, password: "wrong password 1" } });
    expect(res.status).toBe(401);
  });

  it("resets a forgotten password through the mailed link", async () => {
    const ask = await call("/api/auth/request-password-reset", { json: { email, redirectTo: `${base}/reset-password` } });
    expect(ask.status).toBe(200);
    const mail = await waitForMail(email, /Reset your Ampwright password/);
    const link = new URL(firstLink(mail.text));
    const follow = await call(link.pathname + link.search);
    expect(follow.status).toBe(302);
    const token = new URL(follow.headers.get("location")!, base).searchParams.get("token");
    expect(token).toBeTruthy();
    const reset = await call("/api/auth/reset-password", { json: { token, newPassword: "a new password 7" } });
    expect(reset.status).toBe(200);
    expect((await call("/api/auth/sign-in/email", { json: { email, password } })).status).toBe(401);
    expect((await call("/api/auth/sign-in/email", { json: { email, password: "a new password 7" } })).status).toBe(200);
  });
});
