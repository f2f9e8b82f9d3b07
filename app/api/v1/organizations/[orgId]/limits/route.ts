import { db } from "@/db";
import { getLimits, setLimits } from "@/db/queries/limits";
import { orgRoute } from "@/lib/api/authed";
import { LIMIT_FIELDS } from "@/lib/diagnosis/limits";
import { diagnosisLimitsInput } from "@/lib/validators/limits";

const defaults = () => Object.fromEntries(LIMIT_FIELDS.map((f) => [f.key, f.default]));

// GET /api/v1/organizations/:orgId/limits - the diagnosis limits in force (own figures over the common-practice defaults)
export const GET = orgRoute({ permission: "org.read" }, async ({ membership }) => {
  return Response.json({ ...(await getLimits(db, membership.organizationId)), defaults: defaults() });
});

// PUT /api/v1/organizations/:orgId/limits - set the organisation's own figures (owner, lead); a figure left out goes back to its default
export const PUT = orgRoute({ permission: "limits.set", body: diagnosisLimitsInput }, async ({ membership, user, body }) => {
  const own = Object.fromEntries(Object.entries(body.limits).filter(([, v]) => v !== undefined)) as Record<string, number>;
  await setLimits(db, { organizationId: membership.organizationId, userId: user.id, limits: own });
  return Response.json({ ...(await getLimits(db, membership.organizationId)), defaults: defaults() });
});
