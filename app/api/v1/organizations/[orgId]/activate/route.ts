import { db } from "@/db";
import { setSessionOrganization } from "@/db/queries/organizations";
import { orgRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";

// POST /api/v1/organizations/:orgId/activate - work in this organisation from now on (this session only; any member)
export const POST = orgRoute({ permission: "org.read" }, async ({ membership, user }) => {
  if (!user.sessionId) throw new ApiError(401, "signed-out", "Sign in first.");
  await setSessionOrganization(db, user.sessionId, membership.organizationId);
  return Response.json({ activeOrganizationId: membership.organizationId });
});
