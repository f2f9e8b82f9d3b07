import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { attachments, circuits, jobs, member, organization, readings, user } from "@/db/schema";
import { accessColumns, audit, memberOf, newId, type WorkAccess } from "./work";

const uploader = user;
const columns = {
  id: attachments.id,
  jobId: attachments.jobId,
  readingId: attachments.readingId,
  status: attachments.status,
  fileName: attachments.fileName,
  contentType: attachments.contentType,
  sizeBytes: attachments.sizeBytes,
  sha256: attachments.sha256,
  hasThumbnail: attachments.thumbnailKey,
  uploadedByName: uploader.name,
  createdAt: attachments.createdAt,
};

type Row = { hasThumbnail: string | null } & Record<string, unknown>;
const shape = <R extends Row>(r: R) => ({ ...r, hasThumbnail: r.hasThumbnail !== null });

/** A job's finished attachments, oldest first (pending uploads are not listed). */
export async function listAttachments(db: Db, jobId: string) {
  const rows = await db
    .select(columns)
    .from(attachments)
    .leftJoin(uploader, eq(uploader.id, attachments.uploadedBy))
    .where(and(eq(attachments.jobId, jobId), eq(attachments.status, "ready")))
    .orderBy(asc(attachments.createdAt), asc(attachments.id));
  return rows.map(shape);
}

export async function getAttachment(db: Db, id: string) {
  const rows = await db.select(columns).from(attachments).leftJoin(uploader, eq(uploader.id, attachments.uploadedBy)).where(eq(attachments.id, id)).limit(1);
  return rows[0] ? shape(rows[0]) : undefined;
}

/** The storage keys of an attachment (never sent to the browser). */
export async function attachmentKeys(db: Db, id: string) {
  const rows = await db.select({ objectKey: attachments.objectKey, thumbnailKey: attachments.thumbnailKey, status: attachments.status, fileName: attachments.fileName, contentType: attachments.contentType }).from(attachments).where(eq(attachments.id, id)).limit(1);
  return rows[0];
}

export async function attachmentAccess(db: Db, id: string, userId: string): Promise<(WorkAccess & { attachmentId: string }) | undefined> {
  const rows = await db
    .select({ ...accessColumns(), attachmentId: attachments.id })
    .from(attachments)
    .innerJoin(jobs, eq(jobs.id, attachments.jobId))
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, memberOf(userId))
    .where(eq(attachments.id, id))
    .limit(1);
  return rows[0];
}

/** Whether a reading belongs to one of this job's circuits. */
export async function readingInJob(db: Db, readingId: string, jobId: string): Promise<boolean> {
  const rows = await db.select({ id: readings.id }).from(readings).innerJoin(circuits, eq(circuits.id, readings.circuitId)).where(and(eq(readings.id, readingId), eq(circuits.jobId, jobId))).limit(1);
  return rows.length > 0;
}

/** A pending attachment and the staging key its upload goes to (finishing moves the checked file elsewhere). */
export async function createPendingAttachment(
  db: Db,
  p: { organizationId: string; jobId: string; readingId: string | null; fileName: string; contentType: string; sizeBytes: number; userId: string },
): Promise<{ id: string; objectKey: string }> {
  const id = newId("att");
  const objectKey = `staging/${p.organizationId}/${p.jobId}/${id}`;
  await db.insert(attachments).values({
    id,
    organizationId: p.organizationId,
    jobId: p.jobId,
    readingId: p.readingId,
    status: "pending",
    objectKey,
    fileName: p.fileName,
    contentType: p.contentType,
    sizeBytes: p.sizeBytes,
    sha256: "",
    uploadedBy: p.userId,
  });
  return { id, objectKey };
}

export async function markAttachmentReady(
  db: Db,
  p: { id: string; organizationId: string; jobId: string; userId: string; objectKey: string; contentType: string; sizeBytes: number; sha256: string; thumbnailKey: string | null; fileName: string },
) {
  await db.transaction(async (tx) => {
    await tx.update(attachments).set({ status: "ready", objectKey: p.objectKey, contentType: p.contentType, sizeBytes: p.sizeBytes, sha256: p.sha256, thumbnailKey: p.thumbnailKey }).where(eq(attachments.id, p.id));
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "attachment.add", entityType: "job", entityId: p.jobId, detail: { attachmentId: p.id, fileName: p.fileName, contentType: p.contentType, sizeBytes: p.sizeBytes } });
  });
}

export async function deleteAttachmentRow(db: Db, p: { id: string; organizationId: string; jobId: string; userId: string; reason: string }) {
  await db.transaction(async (tx) => {
    const gone = await tx.delete(attachments).where(eq(attachments.id, p.id)).returning({ fileName: attachments.fileName, status: attachments.status });
    if (gone[0]?.status === "ready" || p.reason !== "refused") {
      await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "attachment.remove", entityType: "job", entityId: p.jobId, detail: { attachmentId: p.id, fileName: gone[0]?.fileName ?? null, reason: p.reason } });
    }
  });
}
