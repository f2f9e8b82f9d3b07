import "server-only";
import { APIError, createAuthMiddleware } from "better-auth/api";
import { db } from "@/db";
import { accountByEmail, clearAttempts, countAttempt, recentAttempts } from "@/db/queries/abuse";
import { enqueueMail } from "@/db/queries/mail";
import { env } from "@/lib/env";
import { kickMailWorker } from "@/lib/mail/sender";
import { signInLockedMessage } from "@/lib/mail/templates";
import { clientAddress } from "@/lib/net/client-address";
import { forgotPasswordInput, signInInput, signUpInput } from "@/lib/validators/auth";

type Limit = { max: number; windowS: number };

/**
 * Abuse limits, counted in PostgreSQL (so they hold across server processes). The caller's address is the one
 * lib/net/client-address.ts works out from the socket and TRUSTED_PROXIES, never what the request says of itself.
 * - one address and one account: five tries a minute, so a neighbour at the same address (a shop behind one router)
 *   is not locked out by someone else's mistakes;
 * - one address, whatever the account: a wider cap, so rotating e-mail addresses does not help;
 * - one account, whatever the address: failed sign-ins lock it for a cool-down, and its owner is told by e-mail;
 * - one mailbox, whatever the address: reset and confirmation mail is capped, so nobody floods an inbox.
 */
export const LIMITS: Record<string, Limit> = {
  "/sign-in/email": { max: 5, windowS: 60 },
  "/sign-up/email": { max: 5, windowS: 600 },
  "/request-password-reset": { max: 5, windowS: 600 },
  "/send-verification-email": { max: 5, windowS: 600 },
};
export const ADDRESS_LIMITS: Record<string, Limit> = {
  "/sign-in/email": { max: 60, windowS: 600 },
  "/sign-up/email": { max: 10, windowS: 3600 },
  "/request-password-reset": { max: 10, windowS: 600 },
  "/send-verification-email": { max: 10, windowS: 600 },
};
export const MAILBOX_LIMITS: Record<string, Limit> = {
  "/request-password-reset": { max: 5, windowS: 3600 },
  "/send-verification-email": { max: 5, windowS: 3600 },
};
/** Failed sign-ins of one account from anywhere before it is locked, and how long the lock lasts. */
export const ACCOUNT_FAILURES: Limit = { max: 10, windowS: 15 * 60 };

/** The forms' zod schemas, applied on the server too, so both say the same thing about a field. */
const SCHEMAS: Record<string, { safeParse: (v: unknown) => { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } } }> = {
  "/sign-up/email": signUpInput,
  "/sign-in/email": signInInput,
  "/request-password-reset": forgotPasswordInput,
};

const FIELD_NAMES: Record<string, string> = { email: "E-mail", password: "Password", name: "Name" };
const wait = (windowS: number) => (windowS >= 120 ? `${Math.round(windowS / 60)} minutes` : "a minute");
const tooMany = (message: string) => new APIError("TOO_MANY_REQUESTS", { message });
const emailOf = (body: unknown) => {
  const e = (body as { email?: unknown } | undefined)?.email;
  return typeof e === "string" ? e.trim().toLowerCase() : "";
};
const failureKey = (email: string) => `sign-in-failed|${email}`;

type AuthCall = { path: string; body?: unknown; headers?: Headers; request?: Request };

/** Throws 422 or 429 (as better-auth errors) when a sign-in, sign-up or mail request breaks a limit above. */
export async function enforceAbuseLimits(ctx: AuthCall): Promise<void> {
  const schema = SCHEMAS[ctx.path];
  if (schema) {
    const parsed = schema.safeParse(ctx.body ?? {});
    if (!parsed.success) {
      const what = (parsed.error?.issues ?? []).map((i) => `${FIELD_NAMES[String(i.path[0])] ?? "A field"}: ${i.message}`).join("; ");
      throw new APIError("UNPROCESSABLE_ENTITY", { message: `Some fields need fixing. ${what}.` });
    }
  }
  const limit = LIMITS[ctx.path];
  if (!limit) return;
  const headers = ctx.request?.headers ?? ctx.headers ?? new Headers();
  const address = clientAddress(headers);
  const email = emailOf(ctx.body);
  if (ctx.path === "/sign-in/email" && email && (await recentAttempts(db, failureKey(email), ACCOUNT_FAILURES.windowS)) >= ACCOUNT_FAILURES.max) {
    throw tooMany(`This account is locked for ${wait(ACCOUNT_FAILURES.windowS)} after too many wrong passwords. Its owner has been told by e-mail; "Forgot your password?" still works.`);
  }
  const perAddress = ADDRESS_LIMITS[ctx.path];
  // With no socket address (not served by scripts/serve.mjs) there is no address to cap; the other limits hold.
  if (perAddress && address !== "unknown" && (await countAttempt(db, `${ctx.path}|${address}`, perAddress.windowS)) > perAddress.max) {
    throw tooMany(`Too many attempts from your address. Wait ${wait(perAddress.windowS)} and try again.`);
  }
  const mailbox = MAILBOX_LIMITS[ctx.path];
  if (mailbox && email && (await countAttempt(db, `${ctx.path}|mailbox|${email}`, mailbox.windowS)) > mailbox.max) {
    throw tooMany(`Several messages have already gone to this address. Wait ${wait(mailbox.windowS)}, and look in the spam folder meanwhile.`);
  }
  if ((await countAttempt(db, `${ctx.path}|${address}|${email}`, limit.windowS)) > limit.max) {
    throw tooMany(`Too many attempts. Wait ${wait(limit.windowS)} and try again.`);
  }
}

/** After a sign-in: a failure counts against the account (wherever it came from), a success clears the count. */
export const afterSignIn = createAuthMiddleware(async (ctx) => {
  if (ctx.path !== "/sign-in/email") return;
  const email = emailOf(ctx.body);
  if (!email) return;
  const returned = ctx.context.returned as { statusCode?: number; status?: unknown } | undefined;
  const status = returned instanceof APIError ? returned.statusCode : undefined;
  if (status === undefined) {
    await clearAttempts(db, failureKey(email));
    return;
  }
  if (status !== 401) return;
  const failures = await countAttempt(db, failureKey(email), ACCOUNT_FAILURES.windowS);
  if (failures === ACCOUNT_FAILURES.max) {
    const account = await accountByEmail(db, email);
    if (account) {
      const m = signInLockedMessage({ name: account.name, failures, minutes: Math.round(ACCOUNT_FAILURES.windowS / 60), resetUrl: `${env().APP_URL}/forgot-password` });
      await enqueueMail(db, { to: account.email, kind: "sign-in-locked", ...m });
      kickMailWorker();
    }
  }
});
