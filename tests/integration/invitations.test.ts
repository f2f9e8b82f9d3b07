import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as accept from "@/app/api/v1/invitations/[invitationId]/accept/route";
import * as invitations from "@/app/api/v1/organizations/[orgId]/invitations/route";
import * as revoke from "@/app/api/v1/organizations/[orgId]/invitations/[invitationId]/route";
import * as members from "@/app/api/v1/organizations/[orgId]/members/route";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { auth } from "@/lib/auth/server";
import { firstLink, waitForMail } from "../support/maildev";
import { callRoute, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
let lead = "";
beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  lead = await signInCookie("tobias@larkspur.example", DEMO_PASSWORD);
});
afterAll(() => pool.end());

async function newUser(email: string, name: string) {
  const res = await auth.handler(
    new Request(new URL("/api/auth/sign-up/email", base), {
      method: "POST",
      headers: { origin: base, "content-type": "application/json" },
      body: JSON.stringify({ name, email, password: "invited password 3" }),
    }),
  );
  expect(res.status).toBe(200);
  await pool.query(`update "user" set email_verified = true where email = $1`, [email]);
  return signInCookie(email, "invited password 3");
}

describe("invitations by e-mail", () => {
  it("a lead invites a technician by mail; the invitee accepts and is a member with that role", async () => {
    const email = `new-tech-${Date.now().toString(36)}@larkspur.test`;
    const res = await callRoute(invitations.POST as Handler, { json: { email, role: "technician" }, params: { orgId: demoShop.id }, cookie: lead });
    expect(res.status).toBe(201);
    const mail = await waitForMail(email, /Join Larkspur Road Auto Electric/);
    expect(mail.text).toMatch(/Tobias Venn invites you to join Larkspur Road Auto Electric on Ampwright as Technician/);
    const invitationId = new URL(firstLink(mail.text)).pathname.split("/").pop()!;
    const cookie = await newUser(email, "Wren Ostby");
    const ok = await callRoute(accept.POST as Handler, { method: "POST", params: { invitationId }, cookie });
    expect(ok.status).toBe(200);
    const list = await (await callRoute(members.GET as Handler, { params: { orgId: demoShop.id }, cookie })).json();
    expect(list.members.find((m: { email: string }) => m.email === email)).toMatchObject({ role: "technician", roleLabel: "Technician" });
  });

  it("refuses the link to anyone signed in with another address, as if it did not exist", async () => {
    const email = `invitee-${Date.now().toString(36)}@larkspur.test`;
    const created = await (await callRoute(invitations.POST as Handler, { json: { email, role: "viewer" }, params: { orgId: demoShop.id }, cookie: lead })).json();
    const stranger = await newUser(`stranger-${Date.now().toString(36)}@elsewhere.test`, "Someone Else");
    const res = await callRoute(accept.POST as Handler, { method: "POST", params: { invitationId: created.invitation.id }, cookie: stranger });
    expect(res.status).toBe(404);
  });

  it("a withdrawn or expired invitation can no longer be accepted", async () => {
    const email = `late-${Date.now().toString(36)}@larkspur.test`;
    const created = await (await callRoute(invitations.POST as Handler, { json: { email, role: "viewer" }, params: { orgId: demoShop.id }, cookie: lead })).json();
    const id = created.invitation.id;
    expect((await callRoute(revoke.DELETE as Handler, { method: "DELETE", params: { orgId: demoShop.id, invitationId: id }, cookie: lead })).status).toBe(204);
    const cookie = await newUser(email, "Late Comer");
    expect((await callRoute(accept.POST as Handler, { method: "POST", params: { invitationId: id }, cookie })).status).toBe(410);
    // A fresh one, then 8 days pass (7 days is the limit).
    const again = await (await callRoute(invitations.POST as Handler, { json: { email, role: "viewer" }, params: { orgId: demoShop.id }, cookie: lead })).json();
    expect(new Date(again.invitation.expiresAt).getTime() - Date.now()).toBeGreaterThan(6.9 * 86_400_000);
    await pool.query(`update invitation set expires_at = now() - interval '1 day' where id = $1`, [again.invitation.id]);
    const res = await callRoute(accept.POST as Handler, { method: "POST", params: { invitationId: again.invitation.id }, cookie });
    expect(res.status).toBe(410);
    expect((await res.json()).error.code).toBe("expired");
  });

  it("sign-up answers with what to fix, from the same schema as the form", async () => {
    const res = await auth.handler(
      new Request(new URL("/api/auth/sign-up/email", base), {
        method: "POST",
        headers: { origin: base, "content-type": "application/json" },
        body: JSON.stringify({ name: "", email: "not-an-address", password: "short" }),
      }),
    );
    expect(res.status).toBe(422);
    expect((await res.json()).message).toMatch(/E-mail: enter an e-mail address.*Password: use at least 10 characters/);
  });
});
