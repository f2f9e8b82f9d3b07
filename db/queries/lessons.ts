import "server-only";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { Db } from "@/db";
import { lessonActivity, lessons, lessonVersions, member, organization, user, type LessonQuestion } from "@/db/schema";
import type { CircuitDocument } from "@/lib/circuit";
import { audit, createCircuit, createJob, newId } from "./work";

const publisher = alias(user, "publisher");

export type LessonAccess = { lessonId: string; organizationId: string; organizationName: string; organizationKind: string; role: string | null; latestVersion: number; sourceCircuitId: string | null };

/** A lesson's class and the caller's role in it (role null when they are not a member), in one statement. */
export async function lessonAccess(db: Db, lessonId: string, userId: string): Promise<LessonAccess | undefined> {
  const rows = await db
    .select({
      lessonId: lessons.id,
      organizationId: lessons.organizationId,
      organizationName: organization.name,
      organizationKind: organization.kind,
      role: member.role,
      latestVersion: lessons.latestVersion,
      sourceCircuitId: lessons.sourceCircuitId,
    })
    .from(lessons)
    .innerJoin(organization, eq(organization.id, lessons.organizationId))
    .leftJoin(member, and(eq(member.organizationId, lessons.organizationId), eq(member.userId, userId)))
    .where(eq(lessons.id, lessonId))
    .limit(1);
  return rows[0];
}

/** The lesson already published from a circuit, if any. */
export async function lessonOfCircuit(db: Db, circuitId: string) {
  const rows = await db.select({ id: lessons.id, latestVersion: lessons.latestVersion }).from(lessons).where(eq(lessons.sourceCircuitId, circuitId)).limit(1);
  return rows[0];
}

/**
 * Publishes a circuit's current document as a lesson snapshot: the first publish makes the lesson, each later one
 * adds the next version (earlier versions stay readable).
 */
export async function publishLesson(
  db: Db,
  p: { circuitId: string; organizationId: string; userId: string; title: string; brief: string; questions: LessonQuestion[]; document: CircuitDocument },
): Promise<{ lessonId: string; version: number; created: boolean }> {
  return db.transaction(async (tx) => {
    // The lesson row is made once per circuit: of two publishes at once, the second waits here for the first and
    // then adds the next version, so there is never a second lesson or a failed insert.
    await tx
      .insert(lessons)
      .values({ id: newId("lsn"), organizationId: p.organizationId, sourceCircuitId: p.circuitId, latestVersion: 0, createdBy: p.userId })
      .onConflictDoNothing({ target: lessons.sourceCircuitId });
    const [row] = await tx.select({ id: lessons.id, latestVersion: lessons.latestVersion }).from(lessons).where(eq(lessons.sourceCircuitId, p.circuitId)).for("update").limit(1);
    const lessonId = row.id;
    const version = row.latestVersion + 1;
    const created = version === 1;
    await tx.update(lessons).set({ latestVersion: version, updatedAt: new Date() }).where(eq(lessons.id, lessonId));
    await tx.insert(lessonVersions).values({ lessonId, version, title: p.title, brief: p.brief, questions: p.questions, document: p.document, publishedBy: p.userId });
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: created ? "lesson.publish" : "lesson.republish", entityType: "lesson", entityId: lessonId, detail: { title: p.title, version, circuitId: p.circuitId } });
    return { lessonId, version, created };
  });
}

/** Lessons of every class the user is in, newest first, with what the user did with each and, for instructors, counts. */
export async function listLessons(db: Db, userId: string) {
  const mine = await db.select({ organizationId: member.organizationId, role: member.role }).from(member).where(eq(member.userId, userId));
  if (!mine.length) return [];
  const roleIn = new Map(mine.map((m) => [m.organizationId, m.role]));
  const rows = await db
    .select({
      id: lessons.id,
      organizationId: lessons.organizationId,
      organizationName: organization.name,
      latestVersion: lessons.latestVersion,
      sourceCircuitId: lessons.sourceCircuitId,
      updatedAt: lessons.updatedAt,
      title: lessonVersions.title,
      brief: lessonVersions.brief,
      questionCount: sql<number>`jsonb_array_length(${lessonVersions.questions})`.mapWith(Number),
      publishedAt: lessonVersions.publishedAt,
      publishedByName: publisher.name,
      openedCount: sql<number>`(select count(*) from ${lessonActivity} a where a.lesson_id = ${lessons.id})`.mapWith(Number),
      copiedCount: sql<number>`(select count(*) from ${lessonActivity} a where a.lesson_id = ${lessons.id} and a.copied_at is not null)`.mapWith(Number),
      myLastOpenedAt: lessonActivity.lastOpenedAt,
      myCopiedAt: lessonActivity.copiedAt,
      myCopyJobId: lessonActivity.copyJobId,
    })
    .from(lessons)
    .innerJoin(organization, eq(organization.id, lessons.organizationId))
    .innerJoin(lessonVersions, and(eq(lessonVersions.lessonId, lessons.id), eq(lessonVersions.version, lessons.latestVersion)))
    .leftJoin(publisher, eq(publisher.id, lessonVersions.publishedBy))
    .leftJoin(lessonActivity, and(eq(lessonActivity.lessonId, lessons.id), eq(lessonActivity.userId, userId)))
    .where(inArray(lessons.organizationId, [...roleIn.keys()]))
    .orderBy(desc(lessons.updatedAt), desc(lessons.id));
  return rows.map((r) => {
    const canManage = ["owner", "lead"].includes(roleIn.get(r.organizationId) ?? "");
    // Counts of who opened and copied are the instructor's to see, not the class's.
    return { ...r, canManage, openedCount: canManage ? r.openedCount : null, copiedCount: canManage ? r.copiedCount : null };
  });
}

/** One snapshot of a lesson (the latest when version is not given) and the list of all its snapshots. */
export async function getLessonVersion(db: Db, lessonId: string, version?: number) {
  const versions = await db
    .select({ version: lessonVersions.version, title: lessonVersions.title, publishedAt: lessonVersions.publishedAt, publishedByName: publisher.name })
    .from(lessonVersions)
    .leftJoin(publisher, eq(publisher.id, lessonVersions.publishedBy))
    .where(eq(lessonVersions.lessonId, lessonId))
    .orderBy(desc(lessonVersions.version));
  const want = version ?? versions[0]?.version;
  if (want === undefined) return undefined;
  const rows = await db
    .select({
      version: lessonVersions.version,
      title: lessonVersions.title,
      brief: lessonVersions.brief,
      questions: lessonVersions.questions,
      document: lessonVersions.document,
      publishedAt: lessonVersions.publishedAt,
      publishedByName: publisher.name,
    })
    .from(lessonVersions)
    .leftJoin(publisher, eq(publisher.id, lessonVersions.publishedBy))
    .where(and(eq(lessonVersions.lessonId, lessonId), eq(lessonVersions.version, want)))
    .limit(1);
  const row = rows[0];
  return row ? { snapshot: { ...row, document: row.document as CircuitDocument }, versions } : undefined;
}

/** Records that someone opened a snapshot: the first time makes their row, later ones count. */
export async function recordLessonOpen(db: Db, p: { lessonId: string; userId: string; version: number }) {
  await db
    .insert(lessonActivity)
    .values({ lessonId: p.lessonId, userId: p.userId, lastVersion: p.version })
    .onConflictDoUpdate({
      target: [lessonActivity.lessonId, lessonActivity.userId],
      set: { openCount: sql`${lessonActivity.openCount} + 1`, lastOpenedAt: new Date(), lastVersion: p.version },
    });
}

export async function myLessonActivity(db: Db, lessonId: string, userId: string) {
  const rows = await db
    .select({ openCount: lessonActivity.openCount, copiedAt: lessonActivity.copiedAt, copyJobId: lessonActivity.copyJobId })
    .from(lessonActivity)
    .where(and(eq(lessonActivity.lessonId, lessonId), eq(lessonActivity.userId, userId)))
    .limit(1);
  return rows[0];
}

/**
 * A person's own copy of a lesson snapshot: a new job in the class, owned by them, holding the snapshot as its
 * circuit at version 1. The activity row remembers the latest copy.
 */
export async function copyLesson(db: Db, p: { lessonId: string; organizationId: string; userId: string; version: number; title: string; brief: string; document: CircuitDocument }) {
  const jobId = await createJob(db, {
    organizationId: p.organizationId,
    userId: p.userId,
    title: `${p.title} (my copy)`.slice(0, 200),
    vehicle: "",
    systemVoltage: p.document.systemVoltage,
    complaint: p.brief.slice(0, 4000),
    status: "open",
  });
  const circuitId = await createCircuit(db, { jobId, organizationId: p.organizationId, userId: p.userId, document: p.document, message: `Copied from the lesson "${p.title}", version ${p.version}`, action: "lesson.copy" });
  await db
    .insert(lessonActivity)
    .values({ lessonId: p.lessonId, userId: p.userId, lastVersion: p.version, copiedAt: new Date(), copyJobId: jobId })
    .onConflictDoUpdate({ target: [lessonActivity.lessonId, lessonActivity.userId], set: { copiedAt: new Date(), copyJobId: jobId, lastVersion: p.version } });
  return { jobId, circuitId };
}

/** Everyone in the class with what they did with the lesson (never opened shows as a row without dates). */
export async function lessonActivityFor(db: Db, p: { lessonId: string; organizationId: string }) {
  return db
    .select({
      userId: member.userId,
      name: user.name,
      role: member.role,
      openCount: sql<number>`coalesce(${lessonActivity.openCount}, 0)`.mapWith(Number),
      firstOpenedAt: lessonActivity.firstOpenedAt,
      lastOpenedAt: lessonActivity.lastOpenedAt,
      lastVersion: lessonActivity.lastVersion,
      copiedAt: lessonActivity.copiedAt,
      copyJobId: lessonActivity.copyJobId,
    })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .leftJoin(lessonActivity, and(eq(lessonActivity.lessonId, p.lessonId), eq(lessonActivity.userId, member.userId)))
    .where(eq(member.organizationId, p.organizationId))
    .orderBy(asc(sql`case when ${member.role} = 'student' then 0 else 1 end`), asc(user.name));
}

export async function deleteLesson(db: Db, p: { lessonId: string; organizationId: string; userId: string; title: string }) {
  await db.transaction(async (tx) => {
    await tx.delete(lessons).where(eq(lessons.id, p.lessonId));
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "lesson.delete", entityType: "lesson", entityId: p.lessonId, detail: { title: p.title } });
  });
}
