import "server-only";
import { eq } from "drizzle-orm";
import type { Db } from "@/db";
import { organizationLimits, user } from "@/db/schema";
import { effectiveLimits, type Limits } from "@/lib/diagnosis/limits";
import { audit } from "./work";

/** An organisation's limits: its own figures over the defaults, and who last changed them. */
export async function getLimits(db: Db, organizationId: string): Promise<{ limits: Limits; own: Record<string, number>; updatedAt: Date | null; updatedByName: string | null }> {
  const rows = await db
    .select({ limits: organizationLimits.limits, updatedAt: organizationLimits.updatedAt, updatedByName: user.name })
    .from(organizationLimits)
    .leftJoin(user, eq(user.id, organizationLimits.updatedBy))
    .where(eq(organizationLimits.organizationId, organizationId))
    .limit(1);
  const row = rows[0];
  return { limits: effectiveLimits(row?.limits), own: row?.limits ?? {}, updatedAt: row?.updatedAt ?? null, updatedByName: row?.updatedByName ?? null };
}

/** Replaces an organisation's own figures (those left out go back to the defaults), with an audit line. */
export async function setLimits(db: Db, p: { organizationId: string; userId: string; limits: Record<string, number> }) {
  await db.transaction(async (tx) => {
    await tx
      .insert(organizationLimits)
      .values({ organizationId: p.organizationId, limits: p.limits, updatedBy: p.userId })
      .onConflictDoUpdate({ target: organizationLimits.organizationId, set: { limits: p.limits, updatedBy: p.userId, updatedAt: new Date() } });
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "limits.set", entityType: "organization", entityId: p.organizationId, detail: { limits: p.limits } });
  });
}
