import { sql } from "drizzle-orm";
import { bigserial, check, doublePrecision, index, integer, jsonb, pgTable, real, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
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

/** A photo or PDF in object storage, attached to a job and optionally to one reading (filled by the sharing work). */
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
    objectKey: text("object_key").notNull().unique(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    uploadedBy: text("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("attachments_job_idx").on(t.jobId)],
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
    attachmentId: text("attachment_id").references(() => attachments.id, { onDelete: "set null" }),
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
