import { Pool } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import * as orgs from "@/app/api/v1/organizations/route";
import { auth } from "@/lib/auth/server";
import { callRoute, signInCookie } from "../support/sessions";

const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
afterAll(() => pool.end());

const post = (path: string, json: unknown, cookie?: string) =>
  auth.handler(
    new Request(new URL(path, base), {
      method: "POST",
      headers: { origin: base, "content-type": "application/json", ...(cookie ? { cookie } : {}) },
      body: JSON.stringify(json),
    }),
  );

async function confirmedUser(name: string) {
  const email = `${name.toLowerCase().replace(/\W+/g, "-")}-${Date.now().toString(36)}@larkspur.test`;
  expect((await post("/api/auth/sign-up/email", { name, email, password: "first password 1" })).status).toBe(200);
  await pool.query(`update "user" set email_verified = true where email = $1`, [email]);
  return { email, cookie: await signInCookie(email, "first password 1") };
}

type Handler = Parameters<typeof callRoute>[0];

describe("changing the password and deleting the account", () => {
  it("changes the password with the current one, and only with it", async () => {
    const u = await confirmedUser("Kit Varga");
    expect((await post("/api/auth/change-password", { currentPassword: "not it at all", newPassword: "second password 2" }, u.cookie)).status).toBe(400);
    expect((await post("/api/auth/change-password", { currentPassword: "first password 1", newPassword: "second password 2" }, u.cookie)).status).toBe(200);
    await expect(signInCookie(u.email, "first password 1")).rejects.toThrow(/401/);
    await expect(signInCookie(u.email, "second password 2")).resolves.toMatch(/session_token/);
  });

  it("refuses to delete an account that owns an organisation others use, and says which", async () => {
    const owner = await confirmedUser("Bea Lindqvist");
    const res = await callRoute(orgs.POST as Handler, { json: { name: "Lindqvist Fleet Electric", kind: "shop" }, cookie: owner.cookie });
    const orgId = (await res.json()).organization.id;
    const other = await confirmedUser("Cal Romer");
    const otherId = (await pool.query(`select id from "user" where email = $1`, [other.email])).rows[0].id;
    await pool.query(`insert into member (id, organization_id, user_id, role, created_at) values ($1, $2, $3, 'technician', now())`, [`mem_t_${otherId}`, orgId, otherId]);
    const del = await post("/api/auth/delete-user", { password: "first password 1" }, owner.cookie);
    expect(del.status).toBe(400);
    expect(JSON.stringify(await del.json())).toMatch(/Lindqvist Fleet Electric/);
    expect((await pool.query(`select 1 from "user" where email = $1`, [owner.email])).rowCount).toBe(1);
  });

  it("deletes an account with its personal workshop, as the privacy page says", async () => {
    const u = await confirmedUser("Dee Ashworth");
    const id = (await pool.query(`select id from "user" where email = $1`, [u.email])).rows[0].id;
    const personal = (await pool.query(`select organization_id from member where user_id = $1`, [id])).rows[0].organization_id;
    const del = await post("/api/auth/delete-user", { password: "first password 1" }, u.cookie);
    expect(del.status).toBe(200);
    expect((await pool.query(`select 1 from "user" where id = $1`, [id])).rowCount).toBe(0);
    expect((await pool.query(`select 1 from organization where id = $1`, [personal])).rowCount).toBe(0);
    expect((await pool.query(`select 1 from session where user_id = $1`, [id])).rowCount).toBe(0);
  });
});
