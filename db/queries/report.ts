import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { attachments, circuits, organization } from "@/db/schema";
import { loadCircuit, type CircuitDocument } from "@/lib/circuit";
import type { ReportInput } from "@/lib/report/job-report";
import { getJob, listReadings, listSizings } from "./work";

/** Everything a job report is made from, or undefined when the job is gone. */
export async function loadReportInput(db: Db, jobId: string, only?: { circuitId?: string }): Promise<ReportInput | undefined> {
  const job = await getJob(db, jobId);
  if (!job) return undefined;
  const [org] = await db.select({ name: organization.name }).from(organization).where(eq(organization.id, job.organizationId)).limit(1);
  const rows = await db
    .select({ id: circuits.id, name: circuits.name, version: circuits.version, document: circuits.document })
    .from(circuits)
    .where(only?.circuitId ? and(eq(circuits.jobId, jobId), eq(circuits.id, only.circuitId)) : eq(circuits.jobId, jobId))
    .orderBy(asc(circuits.createdAt), asc(circuits.id));
  const circuitList = await Promise.all(
    rows.map(async (c) => {
      const loaded = loadCircuit(c.document);
      const document: CircuitDocument = loaded.ok ? loaded.document : (c.document as CircuitDocument);
      return { id: c.id, name: c.name, version: c.version, document, readings: await listReadings(db, c.id) };
    }),
  );
  const sizingRows = only?.circuitId ? [] : await listSizings(db, jobId);
  const readingIds = circuitList.flatMap((c) => c.readings.map((r) => r.id));
  const photos = await db
    .select({ readingId: attachments.readingId, fileName: attachments.fileName })
    .from(attachments)
    .where(and(eq(attachments.jobId, jobId), eq(attachments.status, "ready")));
  return {
    job: { ...job, organizationName: org?.name ?? "" },
    circuits: circuitList,
    sizings: sizingRows.map((s) => ({ title: s.title, request: s.request, answer: s.answer, createdAt: s.createdAt })),
    photos: only?.circuitId ? photos.filter((p) => p.readingId && readingIds.includes(p.readingId)) : photos,
    generatedAt: new Date(),
  };
}

