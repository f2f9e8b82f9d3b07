import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { organization as organizationPlugin } from "better-auth/plugins";
import { db } from "@/db";
import { enqueueMail } from "@/db/queries/mail";
import { deleteSoleOrganizations, sharedOwnedOrganizations } from "@/db/queries/accounts";
import { createOrganization } from "@/db/queries/organizations";
import { APIError } from "better-auth/api";
import * as schema from "@/db/schema";
import { env } from "@/lib/env";
import { kickMailWorker, startMailWorker } from "@/lib/mail/sender";
import { resetMessage, verificationMessage } from "@/lib/mail/templates";
import { PASSWORD_MIN } from "@/lib/validators/auth";
import { abuseLimits } from "./abuse";

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
  session: { cookieCache: { enabled: true, maxAge: 60 } },
  // Ampwright's own limits (lib/auth/abuse.ts) replace the built-in address-only limiter.
  rateLimit: { enabled: false },
  hooks: { before: abuseLimits },
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
  disabledPaths: [
    "/organization/create",
    "/organization/update",
    "/organization/delete",
    "/organization/invite-member",
    "/organization/cancel-invitation",
    "/organization/accept-invitation",
    "/organization/reject-invitation",
    "/organization/remove-member",
    "/organization/update-member-role",
    "/organization/leave",
    "/organization/add-member",
  ],
  plugins: [
    organizationPlugin({
      schema: { organization: { additionalFields: { kind: { type: "string", required: true, defaultValue: "shop", input: false } } } },
    }),
    nextCookies(),
  ],
});

export type Session = typeof auth.$Infer.Session;
