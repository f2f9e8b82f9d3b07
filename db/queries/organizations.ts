import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { member, organization } from "@/db/schema";

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
