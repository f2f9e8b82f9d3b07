import { db } from "@/db";
import { removePlan } from "@/db/queries/plans";
import { orgRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";

// DELETE /api/v1/organizations/:orgId/plans/:planId - remove one of the organisation's own test plans (owner, lead)
export const DELETE = orgRoute({ permission: "limits.set" }, async ({ membership, user, params }) => {
  const gone = await removePlan(db, { organizationId: membership.organizationId, userId: user.id, id: params.planId ?? "" });
  if (!gone) throw new ApiError(404, "not-found", "There is no such test plan in this organisation.");
  return new Response(null, { status: 204 });
});
