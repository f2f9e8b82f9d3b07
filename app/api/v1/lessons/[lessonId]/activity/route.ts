import { db } from "@/db";
import { lessonActivityFor } from "@/db/queries/lessons";
import { lessonRoute } from "@/lib/api/lessons";
import { roleLabel } from "@/lib/auth/permissions";

// GET /api/v1/lessons/:lessonId/activity - for the class's instructors: who opened the lesson, which version, and who made a copy
export const GET = lessonRoute({ need: "manage" }, async ({ lesson }) => {
  const rows = await lessonActivityFor(db, { lessonId: lesson.lessonId, organizationId: lesson.organizationId });
  return Response.json({ people: rows.map((r) => ({ ...r, roleLabel: roleLabel(lesson.organizationKind, r.role) })) });
});
