import "server-only";
import { randomUUID } from "node:crypto";
import { and, desc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db";
import { invitation, member, organization, user } from "@/db/schema";
import { enqueueMail, type OutgoingMail } from "./mail";

export const INVITATION_DAYS = 7;

/**
 * How many invitations a day one sender, one organisation and one recipient address may get: enough for a shop
 * taking on staff or a class term starting, too few to use Ampwright as a mailer.
 */
export const INVITATION_LIMITS = { perSenderPerDay: 20, perOrganizationPerDay: 50, perRecipientPerDay: 3 } as const;

export type InvitationRefusal = { refused: "pending"; since: Date } | { refused: "sender" | "organization" | "recipient" };

/**
 * Creates an invitation and queues its mail in the same transaction, unless one to that address is still waiting
 * (the partial unique index decides between two at once) or a daily limit is reached.
 */
export async function createInvitation(
  db: Db,
  params: { organizationId: string; email: string; role: string; inviterId: string; mail: (id: string) => OutgoingMail },
): Promise<{ id: string; expiresAt: Date } | InvitationRefusal> {
  const id = `inv_${randomUUID().replace(/-/g, "")}`;
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const email = params.email.toLowerCase();
  return db.transaction(async (tx) => {
    // Pending invitations past their date no longer count as waiting.
    await tx
      .update(invitation)
      .set({ status: "expired" })
      .where(and(eq(invitation.organizationId, params.organizationId), sql`lower(${invitation.email}) = ${email}`, eq(invitation.status, "pending"), sql`${invitation.expiresAt} <= now()`));
    const waiting = await tx
      .select({ createdAt: invitation.createdAt })
      .from(invitation)
      .where(and(eq(invitation.organizationId, params.organizationId), sql`lower(${invitation.email}) = ${email}`, eq(invitation.status, "pending")))
      .limit(1);
    if (waiting[0]) return { refused: "pending" as const, since: waiting[0].createdAt };
    const day = sql`${invitation.createdAt} > now() - interval '1 day'`;
    const [counts] = await tx
      .select({
        sender: sql<number>`count(*) filter (where ${invitation.inviterId} = ${params.inviterId})::int`,
        organization: sql<number>`count(*) filter (where ${invitation.organizationId} = ${params.organizationId})::int`,
        recipient: sql<number>`count(*) filter (where lower(${invitation.email}) = ${email})::int`,
      })
      .from(invitation)
      .where(day);
    if (counts.sender >= INVITATION_LIMITS.perSenderPerDay) return { refused: "sender" as const };
    if (counts.organization >= INVITATION_LIMITS.perOrganizationPerDay) return { refused: "organization" as const };
    if (counts.recipient >= INVITATION_LIMITS.perRecipientPerDay) return { refused: "recipient" as const };
    const inserted = await tx
      .insert(invitation)
      .values({ id, organizationId: params.organizationId, email, role: params.role, status: "pending", expiresAt, inviterId: params.inviterId })
      .onConflictDoNothing()
      .returning({ id: invitation.id });
    if (!inserted[0]) return { refused: "pending" as const, since: new Date() };
    await enqueueMail(tx, params.mail(id));
    return { id, expiresAt };
  });
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

/**
 * Accepts: the invitation's status change and the member row in one transaction. Of two accepts at once, only the
 * one that moved the invitation from pending adds the member; the other answers false.
 */
export async function acceptInvitation(db: Db, params: { invitationId: string; userId: string; organizationId: string; role: string }): Promise<boolean> {
  return db.transaction(async (tx) => {
    const won = await tx
      .update(invitation)
      .set({ status: "accepted" })
      .where(and(eq(invitation.id, params.invitationId), eq(invitation.status, "pending")))
      .returning({ id: invitation.id });
    if (!won[0]) return false;
    await tx
      .insert(member)
      .values({ id: `mem_${randomUUID()}`, organizationId: params.organizationId, userId: params.userId, role: params.role, createdAt: new Date() })
      .onConflictDoNothing();
    return true;
  });
}
