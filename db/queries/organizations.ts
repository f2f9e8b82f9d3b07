import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq, gt } from "drizzle-orm";
import type { Db } from "@/db";
import { member, organization, session, user } from "@/db/schema";

export type OrgKind = "shop" | "class";

function slugify(name: string): string {
  return (
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 40) || "org"
  );
}

/** Creates an organisation with its first member as owner. */
export async function createOrganization(db: Db, params: { name: string; kind: OrgKind; ownerUserId: string }) {
  const id = `org_${randomUUID().replace(/-/g, "").slice(0, 20)}`;
  const slug = `${slugify(params.name)}-${id.slice(4, 10)}`;
  await db.transaction(async (tx) => {
    await tx.insert(organization).values({ id, name: params.name, slug, kind: params.kind });
    await tx.insert(member).values({ id: `mem_${randomUUID()}`, organizationId: id, userId: params.ownerUserId, role: "owner", createdAt: new Date() });
  });
  return { id, slug };
}

/** The caller's membership of an organisation, or undefined. */
export async function findMembership(db: Db, params: { userId: string; organizationId: string }) {
  const rows = await db
    .select({ role: member.role, organizationId: member.organizationId, kind: organization.kind, name: organization.name })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(and(eq(member.userId, params.userId), eq(member.organizationId, params.organizationId)))
    .limit(1);
  return rows[0];
}

/** Every organisation the user belongs to, with their role, personal first. */
export async function listMemberships(db: Db, userId: string) {
  return db
    .select({ organizationId: organization.id, name: organization.name, slug: organization.slug, kind: organization.kind, role: member.role })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(eq(member.userId, userId))
    .orderBy(member.createdAt);
}

export async function getOrganization(db: Db, organizationId: string) {
  const rows = await db
    .select({ id: organization.id, name: organization.name, slug: organization.slug, kind: organization.kind, createdAt: organization.createdAt })
    .from(organization)
    .where(eq(organization.id, organizationId))
    .limit(1);
  return rows[0];
}

export async function renameOrganization(db: Db, organizationId: string, name: string) {
  await db.update(organization).set({ name }).where(eq(organization.id, organizationId));
}

export async function deleteOrganization(db: Db, organizationId: string) {
  await db.delete(organization).where(eq(organization.id, organizationId));
}

export async function listMembers(db: Db, organizationId: string) {
  return db
    .select({ id: member.id, userId: member.userId, role: member.role, name: user.name, email: user.email, joinedAt: member.createdAt })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, organizationId))
    .orderBy(member.createdAt);
}

export async function findMember(db: Db, organizationId: string, memberId: string) {
  const rows = await db
    .select({ id: member.id, userId: member.userId, role: member.role })
    .from(member)
    .where(and(eq(member.organizationId, organizationId), eq(member.id, memberId)))
    .limit(1);
  return rows[0];
}

export async function setMemberRole(db: Db, organizationId: string, memberId: string, role: string) {
  await db.update(member).set({ role }).where(and(eq(member.organizationId, organizationId), eq(member.id, memberId)));
}

export async function removeMember(db: Db, organizationId: string, memberId: string) {
  await db.delete(member).where(and(eq(member.organizationId, organizationId), eq(member.id, memberId)));
}

/** A session's organisation while its row exists and has not expired (signing out deletes it); else undefined. */
export async function liveSession(db: Db, sessionId: string): Promise<{ activeOrganizationId: string | null } | undefined> {
  const rows = await db.select({ activeOrganizationId: session.activeOrganizationId }).from(session).where(and(eq(session.id, sessionId), gt(session.expiresAt, new Date()))).limit(1);
  return rows[0];
}

/** The organisation a session works in (the caller's membership is checked by the route first). */
export async function setSessionOrganization(db: Db, sessionId: string, organizationId: string) {
  await db.update(session).set({ activeOrganizationId: organizationId, updatedAt: new Date() }).where(eq(session.id, sessionId));
}
