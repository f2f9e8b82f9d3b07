import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { organizationPlans } from "@/db/schema";
import type { Plan } from "@/lib/diagnosis/plans";
import { audit, newId } from "./work";

/** An organisation's own test plans, oldest first. */
export async function listOwnPlans(db: Db, organizationId: string): Promise<{ id: string; plan: Plan; createdAt: Date }[]> {
  const rows = await db
    .select({ id: organizationPlans.id, plan: organizationPlans.plan, createdAt: organizationPlans.createdAt })
    .from(organizationPlans)
    .where(eq(organizationPlans.organizationId, organizationId))
    .orderBy(asc(organizationPlans.createdAt), asc(organizationPlans.id));
  return rows.map((r) => ({ ...r, plan: r.plan as Plan }));
}

/** Adds a plan; false when the organisation already has one with the same id. */
export async function addPlan(db: Db, p: { organizationId: string; userId: string; plan: Plan }): Promise<string | false> {
  const id = newId("pln");
  return db.transaction(async (tx) => {
    const made = await tx
      .insert(organizationPlans)
      .values({ id, organizationId: p.organizationId, planKey: p.plan.id, plan: p.plan, createdBy: p.userId })
      .onConflictDoNothing()
      .returning({ id: organizationPlans.id });
    if (!made.length) return false;
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "plan.add", entityType: "organization", entityId: p.organizationId, detail: { planId: id, name: p.plan.name } });
    return id;
  });
}

export async function removePlan(db: Db, p: { organizationId: string; userId: string; id: string }): Promise<boolean> {
  return db.transaction(async (tx) => {
    const gone = await tx
      .delete(organizationPlans)
      .where(and(eq(organizationPlans.id, p.id), eq(organizationPlans.organizationId, p.organizationId)))
      .returning({ plan: organizationPlans.plan });
    if (!gone.length) return false;
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "plan.remove", entityType: "organization", entityId: p.organizationId, detail: { planId: p.id, name: (gone[0]!.plan as Plan).name } });
    return true;
  });
}
