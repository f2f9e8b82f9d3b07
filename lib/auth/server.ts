import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { organization as organizationPlugin } from "better-auth/plugins";
import { db } from "@/db";
import { enqueueMail } from "@/db/queries/mail";
import { deleteSoleOrganizations, sharedOwnedOrganizations } from "@/db/queries/accounts";
import { createOrganization } from "@/db/queries/organizations";
import { APIError, createAuthMiddleware } from "better-auth/api";
import * as schema from "@/db/schema";
import { env } from "@/lib/env";
import { kickMailWorker, startMailWorker } from "@/lib/mail/sender";
import { resetMessage, verificationMessage } from "@/lib/mail/templates";
import { PASSWORD_MIN } from "@/lib/validators/auth";
import { safeLocalPath } from "@/lib/net/redirect";
import { afterSignIn, enforceAbuseLimits } from "./abuse";

/** A same-site path, or an absolute URL on APP_URL's origin. */
function isLocalTarget(v: unknown): boolean {
  if (typeof v !== "string") return false;
  if (safeLocalPath(v, "") === v) return true;
  try {
    return new URL(v).origin === new URL(env().APP_URL).origin;
  } catch {
    return false;
  }
}

/** Before every better-auth endpoint: the abuse limits, and a password change always ends the other sessions. */
const beforeAuth = createAuthMiddleware(async (ctx) => {
  // Links in mail and the page after sign-up may only lead back into Ampwright.
  for (const source of [ctx.body, ctx.query] as (Record<string, unknown> | undefined)[]) {
    for (const field of ["callbackURL", "redirectTo", "errorCallbackURL", "newUserCallbackURL"]) {
      const v = source?.[field];
      if (v !== undefined && !isLocalTarget(v)) throw new APIError("UNPROCESSABLE_ENTITY", { message: "That link would leave Ampwright; only pages of this site are allowed." });
    }
  }
  if (ctx.path === "/change-password") return { context: { body: { ...(ctx.body ?? {}), revokeOtherSessions: true } } };
  await enforceAbuseLimits(ctx);
});

const e = env();
startMailWorker();

/**
 * better-auth: e-mail and password, sessions in PostgreSQL, and the organization plugin for the organisation
 * tables and the active organisation. Its own organisation-changing routes are switched off: Ampwright's
 * /api/v1 routes decide membership and roles with lib/auth/permissions.ts.
 */
export const auth = betterAuth({
  appName: "Ampwright",
  baseURL: e.APP_URL,
  secret: e.BETTER_AUTH_SECRET ?? "ampwright-development-secret-not-for-production-use",
  trustedOrigins: [e.APP_URL],
  telemetry: { enabled: false },
  database: drizzleAdapter(db, {
    provider: "pg",
    schema: { user: schema.user, session: schema.session, account: schema.account, verification: schema.verification, organization: schema.organization, member: schema.member, invitation: schema.invitation },
  }),
  emailAndPassword: {
    enabled: true,
    requireEmailVerification: true,
    minPasswordLength: PASSWORD_MIN,
    resetPasswordTokenExpiresIn: 3600,
    // A new password ends every session the old one opened (a stolen session dies with the reset).
    revokeSessionsOnPasswordReset: true,
    sendResetPassword: async ({ user, url }) => {
      const m = resetMessage(user.name, url);
      await enqueueMail(db, { to: user.email, kind: "password-reset", ...m });
      kickMailWorker();
    },
  },
  emailVerification: {
    sendOnSignUp: true,
    autoSignInAfterVerification: true,
    expiresIn: 3600,
    sendVerificationEmail: async ({ user, url }) => {
      const m = verificationMessage(user.name, url);
      await enqueueMail(db, { to: user.email, kind: "verify-email", ...m });
      kickMailWorker();
    },
  },
  user: {
    deleteUser: {
      enabled: true,
      // What deleting an account does is stated on /privacy: personal organisations and their work go with it;
      // an organisation others still use must be handed over or deleted first.
      beforeDelete: async (user) => {
        const shared = await sharedOwnedOrganizations(db, user.id);
        if (shared.length) {
          throw new APIError("BAD_REQUEST", {
            message: `You own ${shared.join(", ")}, which other people use. Remove them from it or delete it first.`,
          });
        }
        await deleteSoleOrganizations(db, user.id);
      },
    },
  },
  // No cookie cache: every request checks the session row, so signing out or a password change ends a session at once.
  session: { cookieCache: { enabled: false } },
  // Ampwright's own limits (lib/auth/abuse.ts) replace the built-in address-only limiter.
  rateLimit: { enabled: false },
  hooks: { before: beforeAuth, after: afterSignIn },
  advanced: { useSecureCookies: e.APP_URL.startsWith("https://") },
  databaseHooks: {
    user: {
      create: {
        // Every new user gets a personal shop of their own, as its owner.
        after: async (user) => {
          await createOrganization(db, { name: `${user.name}'s workshop`, kind: "shop", ownerUserId: user.id });
        },
      },
    },
  },
  // Only the paths in AUTH_ROUTES (lib/auth/permissions.ts) are reachable; app/api/auth answers 404 to the rest.
  plugins: [
    organizationPlugin({
      schema: { organization: { additionalFields: { kind: { type: "string", required: true, defaultValue: "shop", input: false } } } },
    }),
    nextCookies(),
  ],
});

export type Session = typeof auth.$Infer.Session;
