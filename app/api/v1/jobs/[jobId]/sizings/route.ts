import { db } from "@/db";
import { createSizing, getSizing, listSizings } from "@/db/queries/work";
import { workRoute } from "@/lib/api/work";
import { sizeCable, summarizeSizing, type SizingRequest } from "@/lib/conductors";
import { saveSizingInput } from "@/lib/validators/cable-size";

// GET /api/v1/jobs/:jobId/sizings - the cable and fuse sizings saved to this job, oldest first
export const GET = workRoute({ resource: "job", need: "read" }, async ({ target }) => {
  return Response.json({ sizings: await listSizings(db, target.jobId) });
});

// POST /api/v1/jobs/:jobId/sizings - keep a sizing with the job; the answer is worked out here, not taken from the caller
export const POST = workRoute({ resource: "job", need: "edit", body: saveSizingInput }, async ({ target, user, body }) => {
  const request = body.request as SizingRequest;
  const answer = summarizeSizing(sizeCable(request));
  const id = await createSizing(db, { jobId: target.jobId, organizationId: target.organizationId, userId: user.id, title: body.title, inputs: body.inputs, request, answer });
  return Response.json({ sizing: await getSizing(db, id) }, { status: 201 });
});
