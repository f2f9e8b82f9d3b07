import "server-only";
import { randomUUID } from "node:crypto";
import { and, desc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db";
import { invitation, member, organization, user } from "@/db/schema";
import { enqueueMail, type OutgoingMail } from "./mail";

export const INVITATION_DAYS = 7;

/** Creates an invitation and queues its mail in the same transaction. */
export async function createInvitation(
  db: Db,
  params: { organizationId: string; email: string; role: string; inviterId: string; mail: (id: string) => OutgoingMail },
) {
  const id = `inv_${randomUUID().replace(/-/g, "")}`;
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  await db.transaction(async (tx) => {
    // A newer invitation replaces a pending one to the same address.
    await tx
      .update(invitation)
      .set({ status: "canceled" })
      .where(and(eq(invitation.organizationId, params.organizationId), eq(invitation.email, params.email), eq(invitation.status, "pending")));
    await tx.insert(invitation).values({ id, organizationId: params.organizationId, email: params.email, role: params.role, status: "pending", expiresAt, inviterId: params.inviterId });
    await enqueueMail(tx, params.mail(id));
  });
  return { id, expiresAt };
}

export async function listInvitations(db: Db, organizationId: string) {
  return db
    .select({ id: invitation.id, email: invitation.email, role: invitation.role, status: invitation.status, expiresAt: invitation.expiresAt, createdAt: invitation.createdAt })
    .from(invitation)
    .where(and(eq(invitation.organizationId, organizationId), eq(invitation.status, "pending"), sql`${invitation.expiresAt} > now()`))
    .orderBy(desc(invitation.createdAt));
}

export async function revokeInvitation(db: Db, organizationId: string, invitationId: string): Promise<boolean> {
  const rows = await db
    .update(invitation)
    .set({ status: "canceled" })
    .where(and(eq(invitation.organizationId, organizationId), eq(invitation.id, invitationId), eq(invitation.status, "pending")))
    .returning({ id: invitation.id });
  return rows.length > 0;
}

/** An invitation with its organisation's name and kind, for the page that accepts it. */
export async function findInvitation(db: Db, invitationId: string) {
  const rows = await db
    .select({
      id: invitation.id,
      email: invitation.email,
      role: invitation.role,
      status: invitation.status,
      expiresAt: invitation.expiresAt,
      expired: sql<boolean>`${invitation.expiresAt} < now()`,
      organizationId: invitation.organizationId,
      organizationName: organization.name,
      kind: organization.kind,
      inviterName: user.name,
    })
    .from(invitation)
    .innerJoin(organization, eq(organization.id, invitation.organizationId))
    .innerJoin(user, eq(user.id, invitation.inviterId))
    .where(eq(invitation.id, invitationId))
    .limit(1);
  return rows[0];
}

/** Accepts: the member row and the invitation's status change in one transaction; joining twice is harmless. */
export async function acceptInvitation(db: Db, params: { invitationId: string; userId: string; organizationId: string; role: string }) {
  await db.transaction(async (tx) => {
    await tx
      .insert(member)
      .values({ id: `mem_${randomUUID()}`, organizationId: params.organizationId, userId: params.userId, role: params.role, createdAt: new Date() })
      .onConflictDoNothing();
    await tx.update(invitation).set({ status: "accepted" }).where(eq(invitation.id, params.invitationId));
  });
}
