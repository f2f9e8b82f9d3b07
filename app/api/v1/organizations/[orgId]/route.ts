import { db } from "@/db";
import { deleteOrganization, getOrganization, renameOrganization } from "@/db/queries/organizations";
import { orgRoute } from "@/lib/api/authed";
import { roleLabel } from "@/lib/auth/permissions";
import { renameOrganizationInput } from "@/lib/validators/organizations";

// GET /api/v1/organizations/:orgId - the organisation and the caller's role in it
export const GET = orgRoute({ permission: "org.read" }, async ({ membership }) => {
  const org = await getOrganization(db, membership.organizationId);
  return Response.json({ organization: { ...org, role: membership.role, roleLabel: roleLabel(membership.kind, membership.role) } });
});

// PATCH /api/v1/organizations/:orgId - rename (owner, lead)
export const PATCH = orgRoute({ permission: "org.update", body: renameOrganizationInput }, async ({ membership, body }) => {
  await renameOrganization(db, membership.organizationId, body.name);
  return Response.json({ organization: { id: membership.organizationId, name: body.name } });
});

// DELETE /api/v1/organizations/:orgId - delete with everything in it (owner only)
export const DELETE = orgRoute({ permission: "org.delete" }, async ({ membership }) => {
  await deleteOrganization(db, membership.organizationId);
  return new Response(null, { status: 204 });
});
