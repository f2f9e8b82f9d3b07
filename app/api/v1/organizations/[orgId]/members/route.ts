import { db } from "@/db";
import { listMembers } from "@/db/queries/organizations";
import { orgRoute } from "@/lib/api/authed";
import { roleLabel } from "@/lib/auth/permissions";

// GET /api/v1/organizations/:orgId/members - who is in the organisation, with their roles
export const GET = orgRoute({ permission: "members.read" }, async ({ membership }) => {
  const rows = await listMembers(db, membership.organizationId);
  return Response.json({ members: rows.map((m) => ({ ...m, roleLabel: roleLabel(membership.kind, m.role) })) });
});
