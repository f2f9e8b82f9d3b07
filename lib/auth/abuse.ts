import "server-only";
import { APIError, createAuthMiddleware } from "better-auth/api";
import { db } from "@/db";
import { countAttempt } from "@/db/queries/abuse";
import { forgotPasswordInput, signInInput, signUpInput } from "@/lib/validators/auth";

/**
 * Abuse limits keyed by client address and e-mail, counted in PostgreSQL (so they hold across server processes):
 * five tries a minute for one address and account, so a neighbour at the same address (a shop behind one router)
 * is not locked out by someone else's mistakes.
 */
export const LIMITS: Record<string, { max: number; windowS: number }> = {
  "/sign-in/email": { max: 5, windowS: 60 },
  "/sign-up/email": { max: 5, windowS: 600 },
  "/request-password-reset": { max: 5, windowS: 600 },
  "/send-verification-email": { max: 5, windowS: 600 },
};

/** The forms' zod schemas, applied on the server too, so both say the same thing about a field. */
const SCHEMAS: Record<string, { safeParse: (v: unknown) => { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } } }> = {
  "/sign-up/email": signUpInput,
  "/sign-in/email": signInInput,
  "/request-password-reset": forgotPasswordInput,
};

export const abuseLimits = createAuthMiddleware(async (ctx) => {
  const schema = SCHEMAS[ctx.path];
  if (schema) {
    const parsed = schema.safeParse(ctx.body ?? {});
    if (!parsed.success) {
      const what = (parsed.error?.issues ?? []).map((i) => `${i.path.map(String).join(".")}: ${i.message}`).join("; ");
      throw new APIError("UNPROCESSABLE_ENTITY", { message: `Some fields need fixing: ${what}.` });
    }
  }
  const limit = LIMITS[ctx.path];
  if (!limit) return;
  const headers = ctx.request?.headers ?? ctx.headers;
  const address = headers?.get("x-forwarded-for")?.split(",")[0]?.trim() || headers?.get("x-real-ip") || "local";
  const email = typeof ctx.body?.email === "string" ? ctx.body.email.trim().toLowerCase() : "";
  const n = await countAttempt(db, `${ctx.path}|${address}|${email}`, limit.windowS);
  if (n > limit.max) {
    throw new APIError("TOO_MANY_REQUESTS", { message: `Too many attempts. Wait ${limit.windowS >= 120 ? `${limit.windowS / 60} minutes` : "a minute"} and try again.` });
  }
});
