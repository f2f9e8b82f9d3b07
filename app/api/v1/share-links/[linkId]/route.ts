import { db } from "@/db";
import { getShareLink, revokeShareLink } from "@/db/queries/sharing";
import { workRoute } from "@/lib/api/work";

// GET /api/v1/share-links/:linkId - one share link (without its token)
export const GET = workRoute({ resource: "share", need: "read" }, async ({ target }) => {
  return Response.json({ link: await getShareLink(db, target.shareLinkId!) });
});

// DELETE /api/v1/share-links/:linkId - revoke: the link answers 404 from now on (the row stays for the record)
export const DELETE = workRoute({ resource: "share", need: "edit" }, async ({ target, user }) => {
  await revokeShareLink(db, { id: target.shareLinkId!, jobId: target.jobId, organizationId: target.organizationId, userId: user.id });
  return Response.json({ link: await getShareLink(db, target.shareLinkId!) });
});
