import { db } from "@/db";
import { revokeInvitation } from "@/db/queries/invitations";
import { orgRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";

// DELETE /api/v1/organizations/:orgId/invitations/:invitationId - revoke a pending invitation (owner, lead)
export const DELETE = orgRoute({ permission: "members.invite" }, async ({ membership, params }) => {
  if (!(await revokeInvitation(db, membership.organizationId, params.invitationId))) {
    throw new ApiError(404, "not-found", "There is no pending invitation with that id here.");
  }
  return new Response(null, { status: 204 });
});
