import { db } from "@/db";
import { getLessonVersion, lessonOfCircuit, publishLesson } from "@/db/queries/lessons";
import { getCircuit } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import type { Membership } from "@/lib/api/authed";
import { workRoute } from "@/lib/api/work";
import { can, roleLabel } from "@/lib/auth/permissions";
import { publishLessonInput } from "@/lib/validators/lessons";

function mayPublish(m: Membership) {
  if (m.kind !== "class") throw new ApiError(403, "forbidden", `Lessons belong to classes; ${m.name} is a shop. Copy the circuit into a class you teach to publish it.`);
  if (!can(m.role, "lessons.publish")) throw new ApiError(403, "forbidden", `Only the class's instructors publish lessons; you are ${roleLabel(m.kind, m.role)} in ${m.name}.`);
}

// GET /api/v1/circuits/:circuitId/lesson - whether the caller may publish this circuit, and the lesson published from it (its latest snapshot's title, brief and questions) or null
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target, membership }) => {
  const canPublish = membership.kind === "class" && can(membership.role, "lessons.publish");
  const lesson = await lessonOfCircuit(db, target.circuitId!);
  if (!lesson) return Response.json({ canPublish, lesson: null });
  const latest = await getLessonVersion(db, lesson.id);
  const s = latest?.snapshot;
  return Response.json({ canPublish, lesson: { id: lesson.id, latestVersion: lesson.latestVersion, title: s?.title ?? "", brief: s?.brief ?? "", questions: s?.questions ?? [], publishedAt: s?.publishedAt ?? null } });
});

// POST /api/v1/circuits/:circuitId/lesson - publish the circuit as it is now to its class (a new snapshot each time)
export const POST = workRoute({ resource: "circuit", need: "read", body: publishLessonInput }, async ({ target, user, membership, body }) => {
  mayPublish(membership);
  const circuit = await getCircuit(db, target.circuitId!);
  if (!circuit) throw new ApiError(404, "not-found", "There is no such circuit.");
  if (!circuit.document.components.length) {
    throw new ApiError(422, "empty-circuit", "This circuit has no parts yet; draw the circuit the class will study, then publish it.");
  }
  const made = await publishLesson(db, { circuitId: circuit.id, organizationId: target.organizationId, userId: user.id, title: body.title, brief: body.brief, questions: body.questions, document: circuit.document });
  return Response.json(
    { lesson: { id: made.lessonId, version: made.version, url: `/lessons/${made.lessonId}` } },
    { status: made.created ? 201 : 200, headers: { location: `/api/v1/lessons/${made.lessonId}` } },
  );
});
