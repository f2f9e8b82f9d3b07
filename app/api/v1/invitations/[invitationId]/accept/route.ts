import { db } from "@/db";
import { acceptInvitation, findInvitation } from "@/db/queries/invitations";
import { userRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";

// POST /api/v1/invitations/:invitationId/accept - join the organisation the signed-in user was invited to
export const POST = userRoute({}, async ({ user, params }) => {
  const inv = await findInvitation(db, params.invitationId);
  // Another person's invitation answers as if it did not exist.
  if (!inv || inv.email.toLowerCase() !== user.email.toLowerCase()) {
    throw new ApiError(404, "not-found", "There is no invitation for your address with that link. Sign in with the address the invitation was sent to.");
  }
  if (inv.status === "canceled") throw new ApiError(410, "revoked", "This invitation was withdrawn. Ask for a new one.");
  if (inv.status === "accepted") return Response.json({ organizationId: inv.organizationId, already: true });
  if (inv.expired) throw new ApiError(410, "expired", "This invitation has expired. Ask for a new one.");
  const won = await acceptInvitation(db, { invitationId: inv.id, userId: user.id, organizationId: inv.organizationId, role: inv.role ?? "viewer" });
  return Response.json({ organizationId: inv.organizationId, ...(won ? {} : { already: true }) });
});
