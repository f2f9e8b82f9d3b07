import { db } from "@/db";
import { addPlan, listOwnPlans } from "@/db/queries/plans";
import { orgRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";
import { BUILT_IN_PLANS } from "@/lib/diagnosis/plans";
import { addPlanInput } from "@/lib/validators/plans";

// GET /api/v1/organizations/:orgId/plans - the built-in test plans and the organisation's own
export const GET = orgRoute({ permission: "org.read" }, async ({ membership }) => {
  return Response.json({ builtIn: BUILT_IN_PLANS, own: await listOwnPlans(db, membership.organizationId) });
});

// POST /api/v1/organizations/:orgId/plans - add a test plan of the organisation's own (owner, lead)
export const POST = orgRoute({ permission: "limits.set", body: addPlanInput }, async ({ membership, user, body }) => {
  if (BUILT_IN_PLANS.some((p) => p.id === body.plan.id)) {
    throw new ApiError(422, "invalid-request", "Some fields need fixing; see issues.", [{ path: "plan.id", message: `"${body.plan.id}" is a built-in plan's id; choose another` }]);
  }
  const id = await addPlan(db, { organizationId: membership.organizationId, userId: user.id, plan: body.plan });
  if (!id) throw new ApiError(409, "duplicate", `${membership.name} already has a plan with the id "${body.plan.id}". Remove it first, or give this one another id.`);
  return Response.json({ plan: { id, plan: body.plan } }, { status: 201 });
});
