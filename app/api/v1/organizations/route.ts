import { db } from "@/db";
import { createOrganization, listMemberships } from "@/db/queries/organizations";
import { userRoute } from "@/lib/api/authed";
import { roleLabel } from "@/lib/auth/permissions";
import { createOrganizationInput } from "@/lib/validators/organizations";

// GET /api/v1/organizations - the organisations the caller belongs to, with their role
export const GET = userRoute({}, async ({ user }) => {
  const rows = await listMemberships(db, user.id);
  return Response.json({ organizations: rows.map((r) => ({ ...r, roleLabel: roleLabel(r.kind, r.role) })) });
});

// POST /api/v1/organizations - create a shop or a class; the caller becomes its owner
export const POST = userRoute({ body: createOrganizationInput }, async ({ user, body }) => {
  const org = await createOrganization(db, { name: body.name, kind: body.kind, ownerUserId: user.id });
  return Response.json({ organization: { id: org.id, slug: org.slug, name: body.name, kind: body.kind, role: "owner" } }, { status: 201 });
});
