import { db } from "@/db";
import { deleteLesson, getLessonVersion, myLessonActivity, recordLessonOpen } from "@/db/queries/lessons";
import { ApiError } from "@/lib/api/errors";
import { lessonRoute } from "@/lib/api/lessons";
import { parseQuery } from "@/lib/api/route";
import { can } from "@/lib/auth/permissions";
import { lessonVersionQuery } from "@/lib/validators/lessons";

// GET /api/v1/lessons/:lessonId - a lesson snapshot, read only (?version=n for an earlier one); records that the caller opened it
export const GET = lessonRoute({ need: "read" }, async ({ req, user, lesson }) => {
  const q = parseQuery(req, lessonVersionQuery);
  const found = await getLessonVersion(db, lesson.lessonId, q.version);
  if (!found) throw new ApiError(404, "not-found", `This lesson has no version ${q.version}; its latest is ${lesson.latestVersion}.`);
  await recordLessonOpen(db, { lessonId: lesson.lessonId, userId: user.id, version: found.snapshot.version });
  const mine = await myLessonActivity(db, lesson.lessonId, user.id);
  return Response.json({
    lesson: {
      id: lesson.lessonId,
      organizationId: lesson.organizationId,
      organizationName: lesson.organizationName,
      latestVersion: lesson.latestVersion,
      sourceCircuitId: lesson.sourceCircuitId,
      canManage: can(lesson.role, "lessons.publish"),
      canCopy: can(lesson.role, "work.create"),
      myCopyJobId: mine?.copyJobId ?? null,
    },
    snapshot: found.snapshot,
    versions: found.versions,
  });
});

// DELETE /api/v1/lessons/:lessonId - withdraw a lesson and all its snapshots (copies students made stay theirs)
export const DELETE = lessonRoute({ need: "manage" }, async ({ user, lesson }) => {
  const found = await getLessonVersion(db, lesson.lessonId);
  await deleteLesson(db, { lessonId: lesson.lessonId, organizationId: lesson.organizationId, userId: user.id, title: found?.snapshot.title ?? "" });
  return new Response(null, { status: 204 });
});
