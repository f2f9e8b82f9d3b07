import "server-only";
import type { z } from "zod";
import { db } from "@/db";
import { findMembership, listMemberships } from "@/db/queries/organizations";
import { attachmentAccess } from "@/db/queries/attachments";
import { shareLinkAccess } from "@/db/queries/sharing";
import { circuitAccess, jobAccess, readCircuitFor, readingAccess, sizingAccess, type WorkAccess } from "@/db/queries/work";
import { can } from "@/lib/auth/permissions";
import { currentUser, type Membership, type SignedIn } from "./authed";
import { ApiError } from "./errors";
import { route } from "./route";

/** What a caller may do with one piece of work, by role and by whether it is their own. */
export function workRights(role: string, isOwn: boolean) {
  return {
    read: can(role, "work.read.all") || (isOwn && can(role, "work.read.own")),
    edit: can(role, "work.edit.all") || (isOwn && can(role, "work.edit.own")),
  };
}

type Resource = "job" | "circuit" | "reading" | "sizing" | "share" | "attachment";
export type WorkTarget = { organizationId: string; ownerId: string | null; jobId: string; circuitId?: string; readingId?: string; sizingId?: string; shareLinkId?: string; attachmentId?: string };
export type CircuitRecord = NonNullable<Awaited<ReturnType<typeof readCircuitFor>>>;
type WorkCtx<TBody> = {
  req: Request;
  body: TBody;
  params: Record<string, string>;
  user: SignedIn;
  membership: Membership;
  target: WorkTarget;
  /** The circuit with its document text, when the route asked for it (one statement with the access check). */
  circuit?: CircuitRecord;
};

type Found = WorkAccess & { circuitId?: string; readingId?: string; sizingId?: string; shareLinkId?: string; attachmentId?: string };
const lookups: Record<Resource, { param: string; find: (id: string, userId: string) => Promise<Found | undefined>; missing: string }> = {
  job: { param: "jobId", find: (id, userId) => jobAccess(db, id, userId), missing: "There is no such job, or it is not yours to see." },
  circuit: {
    param: "circuitId",
    find: async (id, userId) => {
      const row = await circuitAccess(db, id, userId);
      return row ? { ...row, circuitId: id } : undefined;
    },
    missing: "There is no such circuit, or it is not yours to see.",
  },
  reading: {
    param: "readingId",
    find: async (id, userId) => {
      const row = await readingAccess(db, id, userId);
      return row ? { ...row, readingId: id } : undefined;
    },
    missing: "There is no such reading, or it is not yours to see.",
  },
  sizing: {
    param: "sizingId",
    find: (id, userId) => sizingAccess(db, id, userId),
    missing: "There is no such sizing, or it is not yours to see.",
  },
  share: {
    param: "linkId",
    find: (id, userId) => shareLinkAccess(db, id, userId),
    missing: "There is no such share link, or it is not yours to see.",
  },
  attachment: {
    param: "attachmentId",
    find: (id, userId) => attachmentAccess(db, id, userId),
    missing: "There is no such attachment, or it is not yours to see.",
  },
};

/**
 * A route on one job, circuit or reading (by its id in the path). 401 signed out; 404 when it does not exist, the
 * caller is not in its organisation, or their role lets them see only their own work and it is not theirs (ids
 * never leak); 403 when they may see it but not change it.
 */
export function workRoute<S extends z.ZodType | undefined = undefined>(
  options: { resource: Resource; need: "read" | "edit"; body?: S; maxBytes?: number; withCircuit?: boolean },
  handler: (ctx: WorkCtx<S extends z.ZodType ? z.infer<S> : undefined>) => Promise<Response> | Response,
) {
  const lookup = lookups[options.resource];
  return route({ body: options.body, maxBytes: options.maxBytes }, async (ctx) => {
    const user = await currentUser(ctx.req);
    if (!user) throw new ApiError(401, "signed-out", "Sign in first.");
    const id = ctx.params[lookup.param] ?? "";
    // One statement finds the work and the caller's role in its organisation.
    const record = id && options.withCircuit ? await readCircuitFor(db, id, user.id) : undefined;
    const found: Found | undefined = options.withCircuit ? (record ? { ...record, circuitId: id } : undefined) : id ? await lookup.find(id, user.id) : undefined;
    const membership: Membership | undefined =
      found?.role ? { organizationId: found.organizationId, role: found.role, kind: found.organizationKind, name: found.organizationName } : undefined;
    const rights = membership && found ? workRights(membership.role, found.ownerId === user.id) : undefined;
    if (!found || !membership || !rights?.read) throw new ApiError(404, "not-found", lookup.missing);
    const target: WorkTarget = { organizationId: found.organizationId, ownerId: found.ownerId, jobId: found.jobId, circuitId: found.circuitId, readingId: found.readingId, sizingId: found.sizingId, shareLinkId: found.shareLinkId, attachmentId: found.attachmentId };
    if (options.need === "edit" && !rights.edit) {
      throw new ApiError(403, "forbidden", `Your role (${membership.role}) in ${membership.name} lets you read this work but not change it.`);
    }
    return handler({ ...ctx, user, membership, target, circuit: record } as WorkCtx<S extends z.ZodType ? z.infer<S> : undefined>);
  });
}

/**
 * The organisation a list or a new job belongs to: the one named in the request, else the one the user is working
 * in (the header's switcher), else their first. 404 for an organisation they are not in.
 */
export async function chooseOrganization(user: SignedIn, explicit: string | undefined): Promise<Membership> {
  const wanted = explicit ?? user.activeOrganizationId ?? (await listMemberships(db, user.id))[0]?.organizationId;
  const membership = wanted ? await findMembership(db, { userId: user.id, organizationId: wanted }) : undefined;
  if (membership) return membership;
  if (!explicit && user.activeOrganizationId) {
    // The active organisation may have been left or deleted since; fall back to the first one.
    const first = (await listMemberships(db, user.id))[0];
    const m = first ? await findMembership(db, { userId: user.id, organizationId: first.organizationId }) : undefined;
    if (m) return m;
  }
  throw new ApiError(404, "not-found", "There is no such organisation, or you are not a member of it.");
}
