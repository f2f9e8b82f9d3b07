import { db } from "@/db";
import { findMember, removeMember, setMemberRole } from "@/db/queries/organizations";
import { orgRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";
import { assignableRoles, roleLabel, type OrgKind } from "@/lib/auth/permissions";
import { changeRoleInput } from "@/lib/validators/organizations";

async function target(orgId: string, memberId: string) {
  const m = await findMember(db, orgId, memberId);
  if (!m) throw new ApiError(404, "not-found", "There is no such member in this organisation.");
  if (m.role === "owner") throw new ApiError(403, "owner-protected", "The owner cannot be removed or given another role here.");
  return m;
}

// PATCH /api/v1/organizations/:orgId/members/:memberId - change a member's role (owner, lead)
export const PATCH = orgRoute({ permission: "members.role", body: changeRoleInput }, async ({ membership, params, body }) => {
  await target(membership.organizationId, params.memberId);
  if (!assignableRoles(membership.kind as OrgKind, membership.role).includes(body.role)) {
    throw new ApiError(422, "role-not-offered", `A ${membership.kind} does not have the role ${body.role}.`, [{ path: "role", message: "not offered here" }]);
  }
  await setMemberRole(db, membership.organizationId, params.memberId, body.role);
  return Response.json({ member: { id: params.memberId, role: body.role, roleLabel: roleLabel(membership.kind, body.role) } });
});

// DELETE /api/v1/organizations/:orgId/members/:memberId - remove a member (owner, lead)
export const DELETE = orgRoute({ permission: "members.remove" }, async ({ membership, params }) => {
  await target(membership.organizationId, params.memberId);
  await removeMember(db, membership.organizationId, params.memberId);
  return new Response(null, { status: 204 });
});
