import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, count, desc, eq, gt, ilike, lt, max, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { Db } from "@/db";
import { auditEvents, circuitRevisions, circuits, jobs, member, organization, readings, sizings, user } from "@/db/schema";
import type { CircuitDocument } from "@/lib/circuit";
import type { SizingRequest, SizingSummary } from "@/lib/conductors/sizing";
import type { JobStatus } from "@/lib/validators/job-status";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
type Conn = Db | Tx;

export const newId = (prefix: string) => `${prefix}_${randomUUID().replace(/-/g, "").slice(0, 20)}`;

/** One line of the audit trail, written in the caller's transaction. */
export async function audit(
  db: Conn,
  e: { organizationId: string; actorId: string | null; action: string; entityType: string; entityId: string; detail?: Record<string, unknown> },
) {
  await db.insert(auditEvents).values({ ...e, detail: e.detail ?? null });
}

// ---------------------------------------------------------------- access: whose is it, in which organisation

/**
 * Where a piece of work sits and what the caller is in that organisation, in one statement: its organisation and
 * owner (for the own-work rule) and the caller's membership (role null when they are not a member).
 */
export const accessColumns = () => ({
    organizationId: jobs.organizationId,
    ownerId: jobs.ownerId,
    jobId: jobs.id,
    role: member.role,
    organizationName: organization.name,
    organizationKind: organization.kind,
});
export const memberOf = (userId: string) => and(eq(member.organizationId, jobs.organizationId), eq(member.userId, userId));

export type WorkAccess = { organizationId: string; ownerId: string | null; jobId: string; role: string | null; organizationName: string; organizationKind: string };

export async function jobAccess(db: Db, jobId: string, userId: string): Promise<WorkAccess | undefined> {
  const rows = await db
    .select(accessColumns())
    .from(jobs)
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, memberOf(userId))
    .where(eq(jobs.id, jobId))
    .limit(1);
  return rows[0];
}

export async function circuitAccess(db: Db, circuitId: string, userId: string): Promise<WorkAccess | undefined> {
  const rows = await db
    .select(accessColumns())
    .from(circuits)
    .innerJoin(jobs, eq(jobs.id, circuits.jobId))
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, memberOf(userId))
    .where(eq(circuits.id, circuitId))
    .limit(1);
  return rows[0];
}

const readCircuitColumns = () => ({ ...accessColumns(), ...circuitSummary, jobTitle: jobs.title });

function prepareReadCircuit(db: Db, withDocument: boolean) {
  return db
    .select({ ...readCircuitColumns(), documentJson: withDocument ? sql<string>`${circuits.document}::text` : sql<string>`null` })
    .from(circuits)
    .innerJoin(jobs, eq(jobs.id, circuits.jobId))
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, and(eq(member.organizationId, jobs.organizationId), eq(member.userId, sql.placeholder("userId"))))
    .leftJoin(editor, eq(editor.id, circuits.updatedBy))
    .where(eq(circuits.id, sql.placeholder("circuitId")))
    .limit(1)
    .prepare(withDocument ? "read_circuit_for" : "read_circuit_meta_for");
}
let readCircuitStatement: ReturnType<typeof prepareReadCircuit> | undefined;
let readMetaStatement: ReturnType<typeof prepareReadCircuit> | undefined;

/**
 * The JSON text of documents already read, by circuit and version. A saved version never changes (a save or a
 * restore makes a new one), so an entry is right for as long as it is kept; the oldest go past a size cap.
 */
const documentTexts = new Map<string, string>();
let documentTextChars = 0;
export const DOCUMENT_CACHE_CHARS = 32 * 1024 * 1024;

function rememberDocument(key: string, text: string) {
  if (text.length > DOCUMENT_CACHE_CHARS / 4) return;
  documentTexts.set(key, text);
  documentTextChars += text.length;
  for (const [k, v] of documentTexts) {
    if (documentTextChars <= DOCUMENT_CACHE_CHARS) break;
    documentTexts.delete(k);
    documentTextChars -= v.length;
  }
}

/**
 * The circuit GET: where the circuit sits, the caller's role there, and the circuit with its document as the JSON
 * text PostgreSQL holds (passed through to the answer without a parse). A version read before is not fetched again.
 */
export async function readCircuitFor(db: Db, circuitId: string, userId: string) {
  // Named prepared statements: the hottest read skips building and planning its SQL on every request.
  readMetaStatement ??= prepareReadCircuit(db, false);
  const [meta] = await readMetaStatement.execute({ circuitId, userId });
  if (!meta) return undefined;
  const known = documentTexts.get(`${circuitId}@${meta.version}`);
  if (known !== undefined) return { ...meta, documentJson: known };
  readCircuitStatement ??= prepareReadCircuit(db, true);
  const [row] = await readCircuitStatement.execute({ circuitId, userId });
  if (row) rememberDocument(`${circuitId}@${row.version}`, row.documentJson);
  return row;
}

export async function readingAccess(db: Db, readingId: string, userId: string): Promise<(WorkAccess & { circuitId: string }) | undefined> {
  const rows = await db
    .select({ ...accessColumns(), circuitId: circuits.id })
    .from(readings)
    .innerJoin(circuits, eq(circuits.id, readings.circuitId))
    .innerJoin(jobs, eq(jobs.id, circuits.jobId))
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, memberOf(userId))
    .where(eq(readings.id, readingId))
    .limit(1);
  return rows[0];
}

// ---------------------------------------------------------------- jobs

const owner = alias(user, "owner");
const editor = alias(user, "editor");

const jobColumns = {
  id: jobs.id,
  organizationId: jobs.organizationId,
  ownerId: jobs.ownerId,
  ownerName: owner.name,
  vehicleId: jobs.vehicleId,
  title: jobs.title,
  vehicle: jobs.vehicle,
  systemVoltage: jobs.systemVoltage,
  complaint: jobs.complaint,
  findings: jobs.findings,
  repair: jobs.repair,
  status: jobs.status,
  createdAt: jobs.createdAt,
  updatedAt: jobs.updatedAt,
  updatedByName: editor.name,
};

export type JobSort = "updated" | "created" | "title" | "status";
export type JobListParams = {
  organizationId: string;
  /** Only this owner's jobs (for roles that see only their own work). */
  ownerId?: string;
  q?: string;
  status?: JobStatus;
  sort: JobSort;
  dir: "asc" | "desc";
  limit: number;
  /** The position after which to continue: [sort value, id] of the last row of the previous page. */
  after?: [string, string];
};

const sortColumn = { updated: jobs.updatedAt, created: jobs.createdAt, title: jobs.title, status: jobs.status } as const;

/** A page of an organisation's jobs, keyset-paginated on (sort column, id) so pages never skip or repeat. */
export async function listJobs(db: Db, p: JobListParams) {
  const col = sortColumn[p.sort];
  const where: (SQL | undefined)[] = [eq(jobs.organizationId, p.organizationId)];
  if (p.ownerId) where.push(eq(jobs.ownerId, p.ownerId));
  if (p.status) where.push(eq(jobs.status, p.status));
  if (p.q) {
    const like = `%${p.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(or(ilike(jobs.title, like), ilike(jobs.vehicle, like), ilike(jobs.complaint, like)));
  }
  const byTime = p.sort === "updated" || p.sort === "created";
  if (p.after) {
    const [value, id] = p.after;
    // Timestamps are compared as PostgreSQL keeps them (microseconds): a cursor in milliseconds would repeat rows.
    const v = byTime ? sql`${value}::timestamptz` : value;
    const cmp = p.dir === "asc" ? gt : lt;
    where.push(or(cmp(col, v), and(eq(col, v), cmp(jobs.id, id))));
  }
  const order = p.dir === "asc" ? [asc(col), asc(jobs.id)] : [desc(col), desc(jobs.id)];
  const circuitCount = db.$with("cc").as(db.select({ jobId: circuits.jobId, n: count().as("n") }).from(circuits).groupBy(circuits.jobId));
  const rows = await db
    .with(circuitCount)
    .select({ ...jobColumns, circuitCount: sql<number>`coalesce(${circuitCount.n}, 0)::int`, sortText: sql<string>`(${col})::text` })
    .from(jobs)
    .leftJoin(owner, eq(owner.id, jobs.ownerId))
    .leftJoin(editor, eq(editor.id, jobs.updatedBy))
    .leftJoin(circuitCount, eq(circuitCount.jobId, jobs.id))
    .where(and(...where))
    .orderBy(...order)
    .limit(p.limit + 1);
  const page = rows.slice(0, p.limit).map(({ sortText: _, ...job }) => job);
  const last = rows[page.length - 1];
  const next = rows.length > p.limit && last ? ([last.sortText, last.id] as [string, string]) : undefined;
  return { jobs: page, next };
}

export async function getJob(db: Db, jobId: string) {
  const rows = await db.select(jobColumns).from(jobs).leftJoin(owner, eq(owner.id, jobs.ownerId)).leftJoin(editor, eq(editor.id, jobs.updatedBy)).where(eq(jobs.id, jobId)).limit(1);
  return rows[0];
}

export type NewJob = { title: string; vehicle: string; systemVoltage: number; complaint: string; status: JobStatus; vehicleId?: string | null; findings?: string; repair?: string };

export async function createJob(db: Db, p: { organizationId: string; userId: string } & NewJob) {
  const id = newId("job");
  await db.transaction(async (tx) => {
    await tx.insert(jobs).values({
      id,
      organizationId: p.organizationId,
      ownerId: p.userId,
      vehicleId: p.vehicleId ?? null,
      title: p.title,
      vehicle: p.vehicle,
      systemVoltage: p.systemVoltage,
      complaint: p.complaint,
      status: p.status,
      createdBy: p.userId,
      updatedBy: p.userId,
    });
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "job.create", entityType: "job", entityId: id, detail: { title: p.title } });
  });
  return id;
}

export async function updateJob(db: Db, p: { jobId: string; organizationId: string; userId: string; changes: Partial<Omit<NewJob, "vehicleId">> }) {
  await db.transaction(async (tx) => {
    await tx
      .update(jobs)
      .set({ ...p.changes, updatedBy: p.userId, updatedAt: new Date() })
      .where(and(eq(jobs.id, p.jobId), eq(jobs.organizationId, p.organizationId)));
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "job.update", entityType: "job", entityId: p.jobId, detail: p.changes });
  });
}

export async function deleteJob(db: Db, p: { jobId: string; organizationId: string; userId: string }) {
  await db.transaction(async (tx) => {
    const gone = await tx.delete(jobs).where(and(eq(jobs.id, p.jobId), eq(jobs.organizationId, p.organizationId))).returning({ title: jobs.title });
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "job.delete", entityType: "job", entityId: p.jobId, detail: { title: gone[0]?.title } });
  });
}

async function touchJob(tx: Tx, jobId: string, userId: string) {
  await tx.update(jobs).set({ updatedAt: new Date(), updatedBy: userId }).where(eq(jobs.id, jobId));
}

// ---------------------------------------------------------------- circuits and their revisions

const circuitSummary = {
  id: circuits.id,
  jobId: circuits.jobId,
  name: circuits.name,
  version: circuits.version,
  createdAt: circuits.createdAt,
  updatedAt: circuits.updatedAt,
  updatedByName: editor.name,
};

/** A job's circuits with their reading counts, oldest first (the order they were drawn). */
export async function listCircuits(db: Db, jobId: string) {
  const rc = db.$with("rc").as(
    db
      .select({ circuitId: readings.circuitId, n: count().as("n"), lastAt: max(readings.takenAt).as("last_at") })
      .from(readings)
      .groupBy(readings.circuitId),
  );
  return db
    .with(rc)
    .select({
      ...circuitSummary,
      components: sql<number>`jsonb_array_length(${circuits.document}->'components')`,
      wires: sql<number>`jsonb_array_length(${circuits.document}->'wires')`,
      readingCount: sql<number>`coalesce(${rc.n}, 0)::int`,
      lastReadingAt: rc.lastAt,
    })
    .from(circuits)
    .leftJoin(editor, eq(editor.id, circuits.updatedBy))
    .leftJoin(rc, eq(rc.circuitId, circuits.id))
    .where(eq(circuits.jobId, jobId))
    .orderBy(asc(circuits.createdAt), asc(circuits.id));
}

/** The organisation's most recently saved circuits (only this owner's jobs when ownerId is given). */
export async function listRecentCircuits(db: Db, p: { organizationId: string; ownerId?: string; limit: number }) {
  return db
    .select({
      ...circuitSummary,
      jobTitle: jobs.title,
      components: sql<number>`jsonb_array_length(${circuits.document}->'components')`,
    })
    .from(circuits)
    .innerJoin(jobs, eq(jobs.id, circuits.jobId))
    .leftJoin(editor, eq(editor.id, circuits.updatedBy))
    .where(and(eq(jobs.organizationId, p.organizationId), p.ownerId ? eq(jobs.ownerId, p.ownerId) : undefined))
    .orderBy(desc(circuits.updatedAt), desc(circuits.id))
    .limit(p.limit);
}

export async function getCircuit(db: Db, circuitId: string) {
  const rows = await db
    .select({ ...circuitSummary, jobTitle: jobs.title, document: circuits.document })
    .from(circuits)
    .innerJoin(jobs, eq(jobs.id, circuits.jobId))
    .leftJoin(editor, eq(editor.id, circuits.updatedBy))
    .where(eq(circuits.id, circuitId))
    .limit(1);
  const row = rows[0];
  return row ? { ...row, document: row.document as CircuitDocument } : undefined;
}

/** Creates a circuit at version 1 with its first revision, and its readings when imported with them. */
export async function createCircuit(
  db: Db,
  p: { jobId: string; organizationId: string; userId: string; document: CircuitDocument; message?: string; action?: string; readings?: NewReading[] },
) {
  const id = newId("cir");
  await db.transaction(async (tx) => {
    await tx.insert(circuits).values({ id, jobId: p.jobId, name: p.document.name, document: p.document, version: 1, createdBy: p.userId, updatedBy: p.userId });
    await tx.insert(circuitRevisions).values({ circuitId: id, version: 1, name: p.document.name, document: p.document, message: p.message ?? "Created", createdBy: p.userId });
    if (p.readings?.length) {
      await tx.insert(readings).values(p.readings.map((r) => ({ ...readingValues(r), id: newId("rdg"), circuitId: id, takenBy: r.takenBy ?? p.userId })));
    }
    await touchJob(tx, p.jobId, p.userId);
    await audit(tx, {
      organizationId: p.organizationId,
      actorId: p.userId,
      action: p.action ?? "circuit.create",
      entityType: "circuit",
      entityId: id,
      detail: { name: p.document.name, readings: p.readings?.length ?? 0 },
    });
  });
  return id;
}

export type SaveOutcome = { ok: true; version: number } | { ok: false; current: { version: number; document: CircuitDocument; name: string; updatedAt: Date; updatedByName: string | null } };

/**
 * Saves a new version of a circuit only if it is still at `expectedVersion` (optimistic concurrency: the row lock
 * of the UPDATE makes exactly one of several concurrent savers of the same version win). Appends the revision in
 * the same transaction.
 */
export async function saveCircuit(
  db: Db,
  p: { circuitId: string; organizationId: string; userId: string; expectedVersion: number; document: CircuitDocument; message?: string; action?: string },
): Promise<SaveOutcome> {
  const saved = await db.transaction(async (tx) => {
    const rows = await tx
      .update(circuits)
      .set({ document: p.document, name: p.document.name, version: sql`${circuits.version} + 1`, updatedBy: p.userId, updatedAt: new Date() })
      .where(and(eq(circuits.id, p.circuitId), eq(circuits.version, p.expectedVersion)))
      .returning({ version: circuits.version, jobId: circuits.jobId });
    const row = rows[0];
    if (!row) return undefined;
    await tx.insert(circuitRevisions).values({ circuitId: p.circuitId, version: row.version, name: p.document.name, document: p.document, message: p.message ?? null, createdBy: p.userId });
    await touchJob(tx, row.jobId, p.userId);
    await audit(tx, {
      organizationId: p.organizationId,
      actorId: p.userId,
      action: p.action ?? "circuit.save",
      entityType: "circuit",
      entityId: p.circuitId,
      detail: { version: row.version, ...(p.message ? { message: p.message } : {}) },
    });
    return row.version;
  });
  if (saved !== undefined) return { ok: true, version: saved };
  const current = await getCircuit(db, p.circuitId);
  if (!current) throw new Error(`circuit ${p.circuitId} vanished during a save`);
  return { ok: false, current: { version: current.version, document: current.document, name: current.name, updatedAt: current.updatedAt, updatedByName: current.updatedByName } };
}

export async function deleteCircuit(db: Db, p: { circuitId: string; organizationId: string; userId: string }) {
  await db.transaction(async (tx) => {
    const gone = await tx.delete(circuits).where(eq(circuits.id, p.circuitId)).returning({ name: circuits.name, jobId: circuits.jobId });
    if (gone[0]) await touchJob(tx, gone[0].jobId, p.userId);
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "circuit.delete", entityType: "circuit", entityId: p.circuitId, detail: { name: gone[0]?.name } });
  });
}

const author = alias(user, "author");

/** Every saved version, newest first, with who saved it and the size of the circuit then. */
export async function listRevisions(db: Db, circuitId: string) {
  return db
    .select({
      version: circuitRevisions.version,
      name: circuitRevisions.name,
      message: circuitRevisions.message,
      createdAt: circuitRevisions.createdAt,
      createdByName: author.name,
      components: sql<number>`jsonb_array_length(${circuitRevisions.document}->'components')`,
      wires: sql<number>`jsonb_array_length(${circuitRevisions.document}->'wires')`,
    })
    .from(circuitRevisions)
    .leftJoin(author, eq(author.id, circuitRevisions.createdBy))
    .where(eq(circuitRevisions.circuitId, circuitId))
    .orderBy(desc(circuitRevisions.version));
}

export async function getRevision(db: Db, circuitId: string, version: number) {
  const rows = await db
    .select({
      version: circuitRevisions.version,
      name: circuitRevisions.name,
      message: circuitRevisions.message,
      createdAt: circuitRevisions.createdAt,
      createdByName: author.name,
      document: circuitRevisions.document,
    })
    .from(circuitRevisions)
    .leftJoin(author, eq(author.id, circuitRevisions.createdBy))
    .where(and(eq(circuitRevisions.circuitId, circuitId), eq(circuitRevisions.version, version)))
    .limit(1);
  const row = rows[0];
  return row ? { ...row, document: row.document as CircuitDocument } : undefined;
}

// ---------------------------------------------------------------- readings

export type NewReading = {
  stateId: string;
  positive: string;
  negative: string;
  value: number;
  unit: "V" | "mV";
  currentA?: number | null;
  note: string;
  takenAt?: string;
  takenBy?: string | null;
};

/** A reading's columns from its input: the time as a Date, the taker set by the caller. */
function readingValues<R extends Partial<NewReading>>(r: R): Omit<R, "takenAt" | "takenBy"> & { takenAt?: Date } {
  const { takenAt, takenBy: _ignored, ...rest } = r;
  void _ignored;
  return { ...rest, ...(takenAt ? { takenAt: new Date(takenAt) } : {}) };
}

const taker = alias(user, "taker");
const readingColumns = {
  id: readings.id,
  circuitId: readings.circuitId,
  stateId: readings.stateId,
  positive: readings.positive,
  negative: readings.negative,
  value: readings.value,
  unit: readings.unit,
  currentA: readings.currentA,
  note: readings.note,
  takenAt: readings.takenAt,
  takenById: readings.takenBy,
  takenByName: taker.name,
  updatedAt: readings.updatedAt,
};

export async function listReadings(db: Db, circuitId: string) {
  return db.select(readingColumns).from(readings).leftJoin(taker, eq(taker.id, readings.takenBy)).where(eq(readings.circuitId, circuitId)).orderBy(asc(readings.takenAt), asc(readings.id));
}

export async function getReading(db: Db, readingId: string) {
  const rows = await db.select(readingColumns).from(readings).leftJoin(taker, eq(taker.id, readings.takenBy)).where(eq(readings.id, readingId)).limit(1);
  return rows[0];
}

export async function createReading(db: Db, p: { circuitId: string; jobId: string; organizationId: string; userId: string; reading: NewReading }) {
  const id = newId("rdg");
  await db.transaction(async (tx) => {
    await tx.insert(readings).values({ ...readingValues(p.reading), id, circuitId: p.circuitId, takenBy: p.userId });
    await touchJob(tx, p.jobId, p.userId);
    await audit(tx, {
      organizationId: p.organizationId,
      actorId: p.userId,
      action: "reading.create",
      entityType: "reading",
      entityId: id,
      detail: { circuitId: p.circuitId, stateId: p.reading.stateId, positive: p.reading.positive, negative: p.reading.negative, value: p.reading.value, unit: p.reading.unit },
    });
  });
  return id;
}

export async function updateReading(db: Db, p: { readingId: string; jobId: string; organizationId: string; userId: string; changes: Partial<NewReading> }) {
  await db.transaction(async (tx) => {
    await tx.update(readings).set({ ...readingValues(p.changes), updatedAt: new Date() }).where(eq(readings.id, p.readingId));
    await touchJob(tx, p.jobId, p.userId);
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "reading.update", entityType: "reading", entityId: p.readingId, detail: p.changes });
  });
}

export async function deleteReading(db: Db, p: { readingId: string; jobId: string; organizationId: string; userId: string }) {
  await db.transaction(async (tx) => {
    const gone = await tx.delete(readings).where(eq(readings.id, p.readingId)).returning({ circuitId: readings.circuitId, value: readings.value, unit: readings.unit });
    await touchJob(tx, p.jobId, p.userId);
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "reading.delete", entityType: "reading", entityId: p.readingId, detail: gone[0] });
  });
}

// ---------------------------------------------------------------- sizings saved to a job

export async function sizingAccess(db: Db, sizingId: string, userId: string): Promise<(WorkAccess & { sizingId: string }) | undefined> {
  const rows = await db
    .select({ ...accessColumns(), sizingId: sizings.id })
    .from(sizings)
    .innerJoin(jobs, eq(jobs.id, sizings.jobId))
    .innerJoin(organization, eq(organization.id, jobs.organizationId))
    .leftJoin(member, memberOf(userId))
    .where(eq(sizings.id, sizingId))
    .limit(1);
  return rows[0];
}

const sizer = alias(user, "sizer");
const sizingColumns = {
  id: sizings.id,
  jobId: sizings.jobId,
  title: sizings.title,
  inputs: sizings.inputs,
  request: sizings.request,
  answer: sizings.answer,
  createdAt: sizings.createdAt,
  createdByName: sizer.name,
};

/** A job's saved sizings, oldest first. */
export async function listSizings(db: Db, jobId: string) {
  return db.select(sizingColumns).from(sizings).leftJoin(sizer, eq(sizer.id, sizings.createdBy)).where(eq(sizings.jobId, jobId)).orderBy(asc(sizings.createdAt), asc(sizings.id));
}

export async function getSizing(db: Db, sizingId: string) {
  const rows = await db.select(sizingColumns).from(sizings).leftJoin(sizer, eq(sizer.id, sizings.createdBy)).where(eq(sizings.id, sizingId)).limit(1);
  return rows[0];
}

export async function createSizing(
  db: Db,
  p: { jobId: string; organizationId: string; userId: string; title: string; inputs: Record<string, string>; request: SizingRequest; answer: SizingSummary },
) {
  const id = newId("siz");
  await db.transaction(async (tx) => {
    await tx.insert(sizings).values({ id, jobId: p.jobId, title: p.title, inputs: p.inputs, request: p.request, answer: p.answer, createdBy: p.userId });
    await touchJob(tx, p.jobId, p.userId);
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "sizing.create", entityType: "sizing", entityId: id, detail: { jobId: p.jobId, title: p.title, size: p.answer.size } });
  });
  return id;
}

export async function deleteSizing(db: Db, p: { sizingId: string; jobId: string; organizationId: string; userId: string }) {
  await db.transaction(async (tx) => {
    const gone = await tx.delete(sizings).where(eq(sizings.id, p.sizingId)).returning({ title: sizings.title });
    await touchJob(tx, p.jobId, p.userId);
    await audit(tx, { organizationId: p.organizationId, actorId: p.userId, action: "sizing.delete", entityType: "sizing", entityId: p.sizingId, detail: gone[0] });
  });
}

// ---------------------------------------------------------------- history

const actor = alias(user, "actor");

/** The audit trail of one record, newest first. */
export async function listAudit(db: Db, p: { organizationId: string; entityType: string; entityId: string; limit?: number }) {
  return db
    .select({ id: auditEvents.id, action: auditEvents.action, detail: auditEvents.detail, createdAt: auditEvents.createdAt, actorName: actor.name })
    .from(auditEvents)
    .leftJoin(actor, eq(actor.id, auditEvents.actorId))
    .where(and(eq(auditEvents.organizationId, p.organizationId), eq(auditEvents.entityType, p.entityType), eq(auditEvents.entityId, p.entityId)))
    .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
    .limit(p.limit ?? 100);
}
