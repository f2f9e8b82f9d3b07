import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { circuits } from "@/db/schema";
import { createShareLink, getShareLink, listShareLinks } from "@/db/queries/sharing";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { env } from "@/lib/env";
import { createShareLinkInput } from "@/lib/validators/sharing";

// GET /api/v1/jobs/:jobId/share-links - the job's read-only links (their tokens are never stored, so never listed)
export const GET = workRoute({ resource: "job", need: "read" }, async ({ target }) => {
  return Response.json({ links: await listShareLinks(db, target.jobId) });
});

// POST /api/v1/jobs/:jobId/share-links - make a read-only link to the job or one of its circuits; the answer holds the URL once
export const POST = workRoute({ resource: "job", need: "edit", body: createShareLinkInput }, async ({ target, user, body }) => {
  if (body.circuitId) {
    const [c] = await db.select({ id: circuits.id }).from(circuits).where(and(eq(circuits.id, body.circuitId), eq(circuits.jobId, target.jobId))).limit(1);
    if (!c) throw new ApiError(422, "invalid-request", "Some fields need fixing; see issues.", [{ path: "circuitId", message: "this job has no such circuit" }]);
  }
  const expiresAt = body.expiresInDays ? new Date(Date.now() + body.expiresInDays * 86_400_000) : null;
  const made = await createShareLink(db, { jobId: target.jobId, organizationId: target.organizationId, userId: user.id, circuitId: body.circuitId ?? null, label: body.label, expiresAt });
  const link = await getShareLink(db, made.id);
  return Response.json({ link: { ...link, url: `${env().APP_URL}/shared/${made.token}` } }, { status: 201 });
});
