import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db";
import { circuits, jobs, member, organization, shareLinks, user } from "@/db/schema";
import { hashShareToken, newShareToken } from "@/lib/report/tokens";
import { accessColumns, audit, memberOf, newId, type WorkAccess } from "./work";

const maker = user;
const linkColumns = {
  id: shareLinks.id,
  jobId: shareLinks.jobId,
  circuitId: shareLinks.circuitId,
  circuitName: circuits.name,
  label: shareLinks.label,
  expiresAt: shareLinks.expiresAt,
  revokedAt: shareLinks.revokedAt,
  openCount: shareLinks.openCount,
  lastOpenedAt: shareLinks.lastOpenedAt,
  createdAt: shareLinks.createdAt,
  createdByName: maker.name,
};

/** A job's share links, newest first (never their tokens: only hashes are kept). */
export async function listShareLinks(db: Db, jobId: string) {
  return db
    .select(linkColumns)
    .from(shareLinks)
    .leftJoin(circuits, eq(circuits.id, shareLinks.circuitId))
    .leftJoin(maker, eq(maker.id, shareLinks.createdBy))
    .where(eq(shareLinks.jobId, jobId))
    .orderBy(desc(shareLinks.createdAt), desc(shareLinks.id));
}

export async function getShareLink(db: Db, id: string) {
  const rows = await db.select(linkColumns).from(shareLinks).leftJoin(circuits, eq(circuits.id, shareLinks.circuitId)).leftJoin(maker, eq(maker.id, shareLinks.createdBy)).where(eq(shareLinks.id, id)).limit(1);
  return rows[0];
}

/** Makes a link; answers its id and the token, which is shown this once. */
export async function createShareLink(
  db: Db,
  p: { jobId: string; organizationId: string; userId: string; circuitId?: string | null; label: string; expiresAt: Date | null },
): Promise<{ id: string; token: string }> {
  const id = newId("shr");
  const token = newShareToken();
  await db.transaction(async (tx) => {
    await tx.insert(shareLinks).values({
      id,
      organizationId: p.organizationId,
      jobId: p.jobId,
      circuitId: p.circuitId ?? null,
      tokenHash: hashShareToken(token),
      label: p.label,
      expiresAt: p.expiresAt,
      createdBy: p.userId,
    });
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "share.create", entityType: "job", entityId: p.jobId, detail: { linkId: id, circuitId: p.circuitId ?? null, expiresAt: p.expiresAt?.toISOString() ?? null } });
  });
  return { id, token };
}

export async function revokeShareLink(db: Db, p: { id: string; jobId: string; organizationId: string; userId: string }) {
  await db.transaction(async (tx) => {
    await tx.update(shareLinks).set({ revokedAt: sql`coalesce(${shareLinks.revokedAt}, now())` }).where(eq(shareLinks.id, p.id));
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "share.revoke", entityType: "job", entityId: p.jobId, detail: { linkId: p.id } });
  });
}

/** Where a share link sits and the caller's role there (for revoking through the work routes). */
export async function shareLinkAccess(db: Db, id: string, userId: string): Promise<(WorkAccess & { shareLinkId: string }) | undefined> {
  const rows = await db
    .select({ ...accessColumns(), shareLinkId: shareLinks.id })
    .from(shareLinks)
    .innerJoin(jobs, eq(jobs.id, shareLinks.jobId))
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, memberOf(userId))
    .where(eq(shareLinks.id, id))
    .limit(1);
  return rows[0];
}

/**
 * The job (and circuit) a token opens, counting the visit; undefined when no link has this token, or it was
 * revoked, or it has expired. The lookup is by the token's hash, so a stored hash cannot be used as a token.
 */
export async function openShareLink(db: Db, token: string): Promise<{ id: string; jobId: string; circuitId: string | null } | undefined> {
  const rows = await db
    .update(shareLinks)
    .set({ openCount: sql`${shareLinks.openCount} + 1`, lastOpenedAt: sql`now()` })
    .where(and(eq(shareLinks.tokenHash, hashShareToken(token)), sql`${shareLinks.revokedAt} is null`, sql`(${shareLinks.expiresAt} is null or ${shareLinks.expiresAt} > now())`))
    .returning({ id: shareLinks.id, jobId: shareLinks.jobId, circuitId: shareLinks.circuitId });
  return rows[0];
}
