import { db } from "@/db";
import { copyLesson, getLessonVersion } from "@/db/queries/lessons";
import { ApiError } from "@/lib/api/errors";
import { lessonRoute } from "@/lib/api/lessons";
import { parseQuery } from "@/lib/api/route";
import { lessonVersionQuery } from "@/lib/validators/lessons";

// POST /api/v1/lessons/:lessonId/copy - make my own copy of a snapshot (?version=n, else the latest): a job and circuit of mine in the class
export const POST = lessonRoute({ need: "copy" }, async ({ req, user, lesson }) => {
  const q = parseQuery(req, lessonVersionQuery);
  const found = await getLessonVersion(db, lesson.lessonId, q.version);
  if (!found) throw new ApiError(404, "not-found", `This lesson has no version ${q.version}; its latest is ${lesson.latestVersion}.`);
  const s = found.snapshot;
  const made = await copyLesson(db, { lessonId: lesson.lessonId, organizationId: lesson.organizationId, userId: user.id, version: s.version, title: s.title, brief: s.brief, document: s.document });
  return Response.json(
    { copy: { jobId: made.jobId, circuitId: made.circuitId, version: s.version, url: `/circuits/${made.circuitId}/workspace` } },
    { status: 201, headers: { location: `/api/v1/circuits/${made.circuitId}` } },
  );
});
