import { sql } from "drizzle-orm";
import { type AnyPgColumn, bigserial, check, doublePrecision, index, integer, jsonb, pgTable, real, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { organization } from "./organizations";
import { JOB_STATUSES } from "../../lib/validators/job-status";
import { vehicles } from "./vehicles";
import type { SizingRequest, SizingSummary } from "../../lib/conductors/sizing";


const people = {
  createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedBy: text("updated_by").references(() => user.id, { onDelete: "set null" }),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

/**
 * A piece of work on one vehicle: a diagnosis, an upfit, or a worked example for a class. The owner is whose work it
 * is (students and other "own work" roles see only theirs); a deleted account leaves the job to its organisation.
 */
export const jobs = pgTable(
  "jobs",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    ownerId: text("owner_id").references(() => user.id, { onDelete: "set null" }),
    vehicleId: text("vehicle_id").references(() => vehicles.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    vehicle: text("vehicle_description").notNull().default(""),
    systemVoltage: real("system_voltage").notNull().default(12),
    complaint: text("complaint").notNull().default(""),
    /** What the tests showed: the fault and where it is (the report's "found"). */
    findings: text("findings").notNull().default(""),
    /** What was done about it (the report's "repair"). */
    repair: text("repair").notNull().default(""),
    status: text("status", { enum: JOB_STATUSES }).notNull().default("open"),
    ...people,
  },
  (t) => [
    index("jobs_org_updated_idx").on(t.organizationId, t.updatedAt, t.id),
    index("jobs_org_owner_idx").on(t.organizationId, t.ownerId),
    index("jobs_org_status_idx").on(t.organizationId, t.status),
    check("jobs_status_check", sql`${t.status} in ('open', 'diagnosed', 'repaired', 'closed')`),
  ],
);

/** A circuit of a job: the circuit document (lib/circuit) and its version, raised by one on every save. */
export const circuits = pgTable(
  "circuits",
  {
    id: text("id").primaryKey(),
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    document: jsonb("document").notNull(),
    version: integer("version").notNull().default(1),
    ...people,
  },
  (t) => [index("circuits_job_idx").on(t.jobId, t.createdAt), check("circuits_version_check", sql`${t.version} >= 1`)],
);

/** Every saved version of a circuit, version 1 included. Rows are only ever added. */
export const circuitRevisions = pgTable(
  "circuit_revisions",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    circuitId: text("circuit_id")
      .notNull()
      .references(() => circuits.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    name: text("name").notNull(),
    document: jsonb("document").notNull(),
    message: text("message"),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("circuit_revisions_version_idx").on(t.circuitId, t.version)],
);

/**
 * A photo or PDF in object storage, attached to a job and optionally to one of its readings. A row starts
 * "pending" when the upload URL is handed out and becomes "ready" once the server has read the stored bytes and
 * checked their type and size; objects that fail the check are deleted with their row.
 */
export const attachments = pgTable(
  "attachments",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    /** The reading it is evidence for; deleting the reading leaves the photo with the job. */
    readingId: text("reading_id").references((): AnyPgColumn => readings.id, { onDelete: "set null" }),
    status: text("status", { enum: ["pending", "ready"] }).notNull().default("pending"),
    objectKey: text("object_key").notNull().unique(),
    thumbnailKey: text("thumbnail_key"),
    fileName: text("file_name").notNull(),
    /** The type the browser declared, until the upload is checked; then the type read from the bytes. */
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    uploadedBy: text("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("attachments_job_idx").on(t.jobId), index("attachments_reading_idx").on(t.readingId), check("attachments_status_check", sql`${t.status} in ('pending', 'ready')`)],
);

/**
 * A read-only link to one job or one circuit that opens without signing in. Only the SHA-256 of the token is kept;
 * the token itself is shown once, when the link is made.
 */
export const shareLinks = pgTable(
  "share_links",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    /** Set for a link to one circuit; null for a link to the whole job. */
    circuitId: text("circuit_id").references(() => circuits.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    label: text("label").notNull().default(""),
    expiresAt: timestamp("expires_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    openCount: integer("open_count").notNull().default(0),
    lastOpenedAt: timestamp("last_opened_at", { withTimezone: true }),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("share_links_job_idx").on(t.jobId, t.createdAt)],
);

/** A worked circuit an instructor publishes to their class. Each publish adds a frozen version. */
export const lessons = pgTable(
  "lessons",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    /** The circuit it was published from (null once that circuit is deleted; the versions stay). */
    sourceCircuitId: text("source_circuit_id").references(() => circuits.id, { onDelete: "set null" }),
    latestVersion: integer("latest_version").notNull().default(1),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("lessons_org_idx").on(t.organizationId, t.updatedAt), uniqueIndex("lessons_source_idx").on(t.sourceCircuitId)],
);

export type LessonQuestion = { prompt: string };

export const lessonVersions = pgTable(
  "lesson_versions",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    lessonId: text("lesson_id")
      .notNull()
      .references(() => lessons.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    title: text("title").notNull(),
    brief: text("brief").notNull().default(""),
    questions: jsonb("questions").$type<LessonQuestion[]>().notNull().default([]),
    document: jsonb("document").notNull(),
    publishedBy: text("published_by").references(() => user.id, { onDelete: "set null" }),
    publishedAt: timestamp("published_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("lesson_versions_version_idx").on(t.lessonId, t.version)],
);

/** Who in the class opened a lesson and whether they made their own copy (one row per person and lesson). */
export const lessonActivity = pgTable(
  "lesson_activity",
  {
    lessonId: text("lesson_id")
      .notNull()
      .references(() => lessons.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    firstOpenedAt: timestamp("first_opened_at", { withTimezone: true }).notNull().defaultNow(),
    lastOpenedAt: timestamp("last_opened_at", { withTimezone: true }).notNull().defaultNow(),
    openCount: integer("open_count").notNull().default(1),
    lastVersion: integer("last_version").notNull(),
    copiedAt: timestamp("copied_at", { withTimezone: true }),
    copyJobId: text("copy_job_id").references(() => jobs.id, { onDelete: "set null" }),
  },
  (t) => [uniqueIndex("lesson_activity_pk").on(t.lessonId, t.userId)],
);

/**
 * A cable and fuse sizing saved to a job: what was typed (to reopen it on the sizing page), the request in SI
 * units, and the answer the conductor engine gave for it when it was saved.
 */
export const sizings = pgTable(
  "sizings",
  {
    id: text("id").primaryKey(),
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    inputs: jsonb("inputs").$type<Record<string, string>>().notNull(),
    request: jsonb("request").$type<SizingRequest>().notNull(),
    answer: jsonb("answer").$type<SizingSummary>().notNull(),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sizings_job_idx").on(t.jobId, t.createdAt)],
);

/**
 * A meter reading: the voltage between two terminals of a circuit (red probe on `positive`, black on `negative`)
 * in one operating state, with an optional clamp-meter current. The one home of measurements.
 */
export const readings = pgTable(
  "readings",
  {
    id: text("id").primaryKey(),
    circuitId: text("circuit_id")
      .notNull()
      .references(() => circuits.id, { onDelete: "cascade" }),
    stateId: text("state_id").notNull().default("base"),
    positive: text("positive_terminal").notNull(),
    negative: text("negative_terminal").notNull(),
    value: doublePrecision("value").notNull(),
    unit: text("unit", { enum: ["V", "mV"] }).notNull().default("V"),
    currentA: doublePrecision("current_a"),
    note: text("note").notNull().default(""),
    takenBy: text("taken_by").references(() => user.id, { onDelete: "set null" }),
    takenAt: timestamp("taken_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("readings_circuit_idx").on(t.circuitId, t.takenAt), check("readings_unit_check", sql`${t.unit} in ('V', 'mV')`)],
);

/** Who did what to which record, for the history views and for settling "who changed this". */
export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    detail: jsonb("detail"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_events_entity_idx").on(t.entityType, t.entityId, t.createdAt), index("audit_events_org_idx").on(t.organizationId, t.createdAt)],
);

/**
 * An organisation's own diagnosis limits (drops, charging window, state of charge), where they differ from the
 * common-practice defaults in lib/diagnosis/limits.ts. Only the figures the owner or lead changed are stored.
 */
export const organizationLimits = pgTable("organization_limits", {
  organizationId: text("organization_id")
    .primaryKey()
    .references(() => organization.id, { onDelete: "cascade" }),
  limits: jsonb("limits").$type<Record<string, number>>().notNull(),
  updatedBy: text("updated_by").references(() => user.id, { onDelete: "set null" }),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

/** An organisation's own guided test plans (the same data as the built-in ones, checked by planSchema). */
export const organizationPlans = pgTable(
  "organization_plans",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    /** The plan's own id (unique in its organisation and never a built-in plan's). */
    planKey: text("plan_key").notNull(),
    plan: jsonb("plan").notNull(),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("organization_plans_key_idx").on(t.organizationId, t.planKey)],
);
