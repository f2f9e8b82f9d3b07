import { db } from "@/db";
import { createInvitation, INVITATION_DAYS, INVITATION_LIMITS, listInvitations } from "@/db/queries/invitations";
import { orgRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";
import { assignableRoles, roleLabel, type OrgKind } from "@/lib/auth/permissions";
import { env } from "@/lib/env";
import { kickMailWorker } from "@/lib/mail/sender";
import { invitationMessage } from "@/lib/mail/templates";
import { inviteInput } from "@/lib/validators/organizations";

// GET /api/v1/organizations/:orgId/invitations - pending invitations (owner, lead)
export const GET = orgRoute({ permission: "members.invite" }, async ({ membership }) => {
  const rows = await listInvitations(db, membership.organizationId);
  return Response.json({ invitations: rows.map((i) => ({ ...i, roleLabel: roleLabel(membership.kind, i.role ?? "") })) });
});

// POST /api/v1/organizations/:orgId/invitations - invite by address and role; the mail is queued with it
export const POST = orgRoute({ permission: "members.invite", body: inviteInput }, async ({ membership, user, body }) => {
  if (!assignableRoles(membership.kind as OrgKind, membership.role).includes(body.role)) {
    throw new ApiError(422, "role-not-offered", `A ${membership.kind} does not offer the role ${body.role}.`, [{ path: "role", message: "not offered here" }]);
  }
  const label = roleLabel(membership.kind, body.role);
  const inv = await createInvitation(db, {
    organizationId: membership.organizationId,
    email: body.email,
    role: body.role,
    inviterId: user.id,
    mail: (id) => ({
      to: body.email,
      kind: "invitation",
      ...invitationMessage({ inviter: user.name, organization: membership.name, roleLabel: label, url: `${env().APP_URL}/invitations/${id}`, days: INVITATION_DAYS }),
    }),
  });
  if ("refused" in inv) {
    if (inv.refused === "pending") {
      throw new ApiError(409, "already-invited", `An invitation to ${body.email} is already waiting (sent ${inv.since.toISOString().slice(0, 10)}). Withdraw it first to send a new one.`);
    }
    const who = { sender: "you have sent", organization: `${membership.name} has sent`, recipient: "this address has received" }[inv.refused];
    const max = { sender: INVITATION_LIMITS.perSenderPerDay, organization: INVITATION_LIMITS.perOrganizationPerDay, recipient: INVITATION_LIMITS.perRecipientPerDay }[inv.refused];
    throw new ApiError(429, "too-many-invitations", `Invitations are limited: ${who} ${max} in the last 24 hours. Try again tomorrow.`);
  }
  kickMailWorker();
  return Response.json({ invitation: { id: inv.id, email: body.email, role: body.role, roleLabel: label, expiresAt: inv.expiresAt } }, { status: 201 });
});
