import { z } from "zod";
import { circuitSchemaV1 } from "@/lib/circuit";
import { cableSizeRequest, saveSizingInput } from "@/lib/validators/cable-size";
import { startUploadInput } from "@/lib/validators/attachments";
import { lessonVersionQuery, publishLessonInput } from "@/lib/validators/lessons";
import { diagnosisLimitsInput } from "@/lib/validators/limits";
import { addPlanInput } from "@/lib/validators/plans";
import { changeRoleInput, createOrganizationInput, inviteInput, renameOrganizationInput } from "@/lib/validators/organizations";
import { createShareLinkInput, emailReportInput } from "@/lib/validators/sharing";
import { solveRequest } from "@/lib/validators/solve";
import {
  circuitDocumentField,
  createCircuitInput,
  createJobInput,
  createReadingInput,
  importInput,
  listJobsQuery,
  replaceCircuitInput,
  restoreCircuitInput,
  updateJobInput,
  updateReadingInput,
} from "@/lib/validators/work";

type Op = {
  method: "get" | "post" | "put" | "patch" | "delete";
  path: string;
  summary: string;
  /** Who may call it, in words (the permission table decides). */
  access: string;
  body?: z.ZodType;
  query?: z.ZodObject;
  responses: Record<string, string>;
  ifMatch?: boolean;
};

const common = {
  "400": "Malformed JSON, or a NUL or broken character anywhere in the request",
  "401": "Not signed in",
  "404": "No such record, or not yours to see",
  "415": "A body that is not sent as application/json",
  "422": "A field needs fixing; see error.issues",
};

/** Every documented route: the API reference page and openapi.json are both drawn from this list. */
export const OPERATIONS: Op[] = [
  { method: "get", path: "/api/v1/jobs", summary: "List jobs of a shop or class", access: "members; own-work roles see their own jobs", query: listJobsQuery, responses: { "200": "A page of jobs and nextCursor", ...common } },
  { method: "post", path: "/api/v1/jobs", summary: "Open a job", access: "owner, lead, technician, student", body: createJobInput, responses: { "201": "The job", "403": "Role may not open jobs", ...common } },
  { method: "get", path: "/api/v1/jobs/{jobId}", summary: "A job with its circuits and reading counts", access: "who may read the job", responses: { "200": "The job and circuits", ...common } },
  { method: "patch", path: "/api/v1/jobs/{jobId}", summary: "Change a job's title, vehicle, complaint, findings, repair or status", access: "who may edit the job", body: updateJobInput, responses: { "200": "The job", "403": "Read-only role", ...common } },
  { method: "delete", path: "/api/v1/jobs/{jobId}", summary: "Delete a job with everything in it", access: "who may edit the job", responses: { "204": "Deleted", "403": "Read-only role", ...common } },
  { method: "get", path: "/api/v1/jobs/{jobId}/circuits", summary: "A job's circuits", access: "who may read the job", responses: { "200": "Circuits", ...common } },
  { method: "post", path: "/api/v1/jobs/{jobId}/circuits", summary: "Add a circuit (empty by name, or from a document)", access: "who may edit the job", body: createCircuitInput, responses: { "201": "The circuit at version 1 (ETag \"1\")", "413": "Body over 4 MB", ...common } },
  { method: "post", path: "/api/v1/jobs/{jobId}/import", summary: "Add a circuit from an export file or a bare document", access: "who may edit the job", body: importInput, responses: { "201": "The circuit and the number of readings imported", "413": "Body over 4 MB", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}", summary: "A circuit document and its version", access: "who may read the job", responses: { "200": "The circuit; ETag is its version", ...common } },
  {
    method: "put",
    path: "/api/v1/circuits/{circuitId}",
    summary: "Save a new version of a circuit",
    access: "who may edit the job",
    body: replaceCircuitInput,
    ifMatch: true,
    responses: { "200": "The new version (ETag)", "412": "Someone saved since: error plus current { version, document }", "428": "If-Match missing", "413": "Body over 4 MB", ...common },
  },
  { method: "delete", path: "/api/v1/circuits/{circuitId}", summary: "Delete a circuit with its history and readings", access: "who may edit the job", responses: { "204": "Deleted", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/revisions", summary: "Every saved version, newest first", access: "who may read the job", responses: { "200": "Revisions", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/revisions/{version}", summary: "One saved version's document", access: "who may read the job", responses: { "200": "The revision", ...common } },
  { method: "post", path: "/api/v1/circuits/{circuitId}/restore", summary: "Save an earlier version as the newest", access: "who may edit the job", body: restoreCircuitInput, responses: { "200": "The new version", "412": "Someone saved meanwhile (when If-Match is sent)", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/readings", summary: "Meter readings on a circuit", access: "who may read the job", responses: { "200": "Readings", ...common } },
  { method: "post", path: "/api/v1/circuits/{circuitId}/readings", summary: "Record a reading between two terminals", access: "who may edit the job", body: createReadingInput, responses: { "201": "The reading", ...common } },
  { method: "patch", path: "/api/v1/readings/{readingId}", summary: "Correct a reading", access: "who may edit the job", body: updateReadingInput, responses: { "200": "The reading", ...common } },
  { method: "delete", path: "/api/v1/readings/{readingId}", summary: "Remove a reading", access: "who may edit the job", responses: { "204": "Deleted", ...common } },
  { method: "get", path: "/api/v1/jobs/{jobId}/sizings", summary: "Cable and fuse sizings saved to a job", access: "who may read the job", responses: { "200": "Sizings", ...common } },
  { method: "post", path: "/api/v1/jobs/{jobId}/sizings", summary: "Save a sizing to a job (the answer is worked out on the server)", access: "who may edit the job", body: saveSizingInput, responses: { "201": "The sizing", ...common } },
  { method: "get", path: "/api/v1/sizings/{sizingId}", summary: "One saved sizing", access: "who may read the job", responses: { "200": "The sizing", ...common } },
  { method: "delete", path: "/api/v1/sizings/{sizingId}", summary: "Remove a saved sizing", access: "who may edit the job", responses: { "204": "Deleted", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/export", summary: "Download the document with its readings as one JSON file", access: "who may read the job", responses: { "200": "The export file", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/readings.csv", summary: "The readings with the model's prediction and verdict, as CSV", access: "who may read the job", responses: { "200": "text/csv", "409": "The stored document no longer loads", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/diagnosis", summary: "Every reading against the model (prediction, difference, verdict, implied resistance and heat) and where the readings put extra resistance", access: "who may read the job", responses: { "200": "readings and location", "409": "The stored document no longer loads", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/plans/{planId}/verdict", summary: "A test plan's checks (good, bad, cannot tell yet, to read) and its verdict with reasons, by the organisation's limits", access: "who may read the job", responses: { "200": "steps and verdict", "409": "The stored document no longer loads", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/results.csv", summary: "Every part and cable solved in every operating state, as CSV", access: "who may read the job", responses: { "200": "text/csv", "409": "The stored document no longer loads", ...common } },
  { method: "get", path: "/api/v1/jobs/{jobId}/report.pdf", summary: "The job report as a PDF (?inline=1 to view it in the browser)", access: "who may read the job", responses: { "200": "application/pdf", ...common } },
  { method: "post", path: "/api/v1/jobs/{jobId}/report/email", summary: "E-mail the report as a PDF, with an optional read-only link", access: "who may edit the job", body: emailReportInput, responses: { "202": "Queued in the outbox", "403": "Read-only role", "429": "Too many reports sent in the last hour", ...common } },
  { method: "get", path: "/api/v1/jobs/{jobId}/share-links", summary: "A job's read-only links (never their tokens)", access: "who may read the job", responses: { "200": "Links", ...common } },
  { method: "post", path: "/api/v1/jobs/{jobId}/share-links", summary: "Make a read-only link to the job or one circuit; the URL is in this answer only", access: "who may edit the job", body: createShareLinkInput, responses: { "201": "The link with its url", "403": "Read-only role", ...common } },
  { method: "get", path: "/api/v1/share-links/{linkId}", summary: "One share link", access: "who may read the job", responses: { "200": "The link", ...common } },
  { method: "delete", path: "/api/v1/share-links/{linkId}", summary: "Revoke a share link (it answers 404 from then on)", access: "who may edit the job", responses: { "200": "The revoked link", "403": "Read-only role", ...common } },
  { method: "get", path: "/api/v1/jobs/{jobId}/attachments", summary: "The job's photos and PDFs (finished uploads), each with the reading it belongs to", access: "who may read the job", responses: { "200": "Attachments", ...common } },
  { method: "post", path: "/api/v1/jobs/{jobId}/attachments", summary: "Start an upload: a record and a presigned URL to PUT the file to, then POST its complete URL", access: "who may edit the job", body: startUploadInput, responses: { "201": "The upload URL and headers", "403": "Read-only role", ...common } },
  { method: "get", path: "/api/v1/attachments/{attachmentId}", summary: "One attachment: type read from its bytes, size, SHA-256, who and when", access: "who may read the job", responses: { "200": "The attachment", ...common } },
  { method: "delete", path: "/api/v1/attachments/{attachmentId}", summary: "Remove a file from storage and the job", access: "who may edit the job", responses: { "204": "Deleted", "403": "Read-only role", ...common } },
  { method: "post", path: "/api/v1/attachments/{attachmentId}/complete", summary: "Finish an upload: check type and size from the stored bytes, make a thumbnail", access: "who may edit the job", responses: { "200": "The attachment", "409": "Nothing uploaded yet", ...common, "422": "Too large, empty, not a photo or PDF, or a PDF with a script or launch action (the file is removed)" } },
  { method: "get", path: "/api/v1/attachments/{attachmentId}/file", summary: "A photo: redirect to a short-lived URL (?variant=thumbnail, ?download=1); a PDF: the file itself, as a download", access: "who may read the job", responses: { "200": "The PDF (attachment, nosniff)", "302": "Presigned URL of the photo", ...common } },
  { method: "get", path: "/api/v1/circuits/{circuitId}/lesson", summary: "Whether the caller may publish this circuit as a lesson, and the lesson made from it", access: "who may read the circuit", responses: { "200": "canPublish and the lesson or null", ...common } },
  { method: "post", path: "/api/v1/circuits/{circuitId}/lesson", summary: "Publish the circuit as it is now to its class as a lesson (again: a new version)", access: "a class's owner or instructor", body: publishLessonInput, responses: { "201": "The new lesson", "200": "A new version of the lesson", "403": "Not an instructor, or not a class", ...common } },
  { method: "get", path: "/api/v1/lessons", summary: "Lessons of every class the caller is in (instructors also get counts)", access: "signed in", responses: { "200": "Lessons", "401": "Not signed in" } },
  { method: "get", path: "/api/v1/lessons/{lessonId}", summary: "A lesson snapshot, read only (?version=n for an earlier one); records the opening", access: "members of the class", query: lessonVersionQuery, responses: { "200": "The snapshot and the list of versions", ...common } },
  { method: "delete", path: "/api/v1/lessons/{lessonId}", summary: "Withdraw a lesson and its versions (copies stay with their owners)", access: "a class's owner or instructor", responses: { "204": "Withdrawn", "403": "Not an instructor", ...common } },
  { method: "post", path: "/api/v1/lessons/{lessonId}/copy", summary: "Make the caller's own copy of a snapshot: a job and circuit of theirs (?version=n)", access: "members who may make work in the class", query: lessonVersionQuery, responses: { "201": "The new job and circuit", "403": "Observer", ...common } },
  { method: "get", path: "/api/v1/lessons/{lessonId}/activity", summary: "Who in the class opened the lesson, which version, and who copied it", access: "a class's owner or instructor", responses: { "200": "People", "403": "Not an instructor", ...common } },
  { method: "get", path: "/api/v1/organizations", summary: "The shops and classes the caller belongs to, with their role", access: "signed in", responses: { "200": "Organisations", "401": "Not signed in" } },
  { method: "post", path: "/api/v1/organizations", summary: "Create a shop or a class; the caller becomes its owner", access: "signed in", body: createOrganizationInput, responses: { "201": "The organisation", "401": "Not signed in", "422": "A field needs fixing" } },
  { method: "get", path: "/api/v1/organizations/{orgId}", summary: "One organisation and the caller's role in it", access: "members", responses: { "200": "The organisation", ...common } },
  { method: "post", path: "/api/v1/organizations/{orgId}/activate", summary: "Work in this organisation from now on (this session)", access: "members", responses: { "200": "The active organisation", ...common } },
  { method: "patch", path: "/api/v1/organizations/{orgId}", summary: "Rename an organisation", access: "owner, lead", body: renameOrganizationInput, responses: { "200": "Renamed", "403": "Role may not", ...common } },
  { method: "delete", path: "/api/v1/organizations/{orgId}", summary: "Delete an organisation with everything in it", access: "owner", responses: { "204": "Deleted", "403": "Role may not", ...common } },
  { method: "get", path: "/api/v1/organizations/{orgId}/members", summary: "Who is in the organisation, with their roles", access: "members but students", responses: { "200": "Members", "403": "Role may not", ...common } },
  { method: "patch", path: "/api/v1/organizations/{orgId}/members/{memberId}", summary: "Change a member's role", access: "owner, lead", body: changeRoleInput, responses: { "200": "Changed", "403": "Role may not, or the owner", ...common } },
  { method: "delete", path: "/api/v1/organizations/{orgId}/members/{memberId}", summary: "Remove a member", access: "owner, lead", responses: { "204": "Removed", "403": "Role may not, or the owner", ...common } },
  { method: "get", path: "/api/v1/organizations/{orgId}/invitations", summary: "Pending invitations", access: "owner, lead", responses: { "200": "Invitations", "403": "Role may not", ...common } },
  { method: "post", path: "/api/v1/organizations/{orgId}/invitations", summary: "Invite by address and role; the mail goes through the outbox", access: "owner, lead", body: inviteInput, responses: { "201": "The invitation", "403": "Role may not", "409": "An invitation to that address is already waiting", "429": "Daily invitation limit reached (per sender, organisation or recipient)", ...common } },
  { method: "delete", path: "/api/v1/organizations/{orgId}/invitations/{invitationId}", summary: "Revoke a pending invitation", access: "owner, lead", responses: { "204": "Revoked", "403": "Role may not", ...common } },
  { method: "get", path: "/api/v1/organizations/{orgId}/limits", summary: "The diagnosis limits in force: the organisation's own figures over the common-practice defaults", access: "members", responses: { "200": "Limits, own figures and defaults", ...common } },
  { method: "put", path: "/api/v1/organizations/{orgId}/limits", summary: "Set the organisation's own diagnosis limits (a figure left out goes back to its default)", access: "owner, lead", body: diagnosisLimitsInput, responses: { "200": "The limits now in force", "403": "Role may not", ...common } },
  { method: "get", path: "/api/v1/organizations/{orgId}/plans", summary: "The built-in guided test plans and the organisation's own", access: "members", responses: { "200": "Plans", ...common } },
  { method: "post", path: "/api/v1/organizations/{orgId}/plans", summary: "Add a test plan of the organisation's own (steps, lead positions, states, rules)", access: "owner, lead", body: addPlanInput, responses: { "201": "The plan", "403": "Role may not", "409": "A plan with that id exists", ...common } },
  { method: "delete", path: "/api/v1/organizations/{orgId}/plans/{planId}", summary: "Remove one of the organisation's own test plans", access: "owner, lead", responses: { "204": "Removed", "403": "Role may not", ...common } },
  { method: "post", path: "/api/v1/invitations/{invitationId}/accept", summary: "Join the organisation the signed-in user was invited to", access: "the invited address, signed in", responses: { "200": "Joined", ...common } },
  { method: "post", path: "/api/v1/solve", summary: "Solve one operating state of a circuit", access: "anyone", body: solveRequest, responses: { "200": "The solved circuit", "413": "Body over 4 MB", "422": "Invalid document" } },
  { method: "post", path: "/api/v1/cable-size", summary: "Size a cable and fuse for a load", access: "anyone", body: cableSizeRequest, responses: { "200": "The sizing", "422": "A field needs fixing" } },
];

function schemaOf(s: z.ZodType) {
  return z.toJSONSchema(s, {
    io: "input",
    unrepresentable: "any",
    target: "openapi-3.0",
    override: (ctx) => {
      // The document field is read by lib/circuit (with migration); describe it by the current version's schema.
      if (ctx.zodSchema === circuitDocumentField) {
        for (const k of Object.keys(ctx.jsonSchema)) delete (ctx.jsonSchema as Record<string, unknown>)[k];
        Object.assign(ctx.jsonSchema, { $ref: "#/components/schemas/CircuitDocument" });
      }
    },
  });
}

/** The OpenAPI 3.0 document of API v1, generated from the zod schemas the handlers parse with. */
export function openApiDocument() {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of OPERATIONS) {
    const params = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => ({ name: m[1], in: "path", required: true, schema: { type: "string" } }));
    if (op.query) {
      const q = schemaOf(op.query) as { properties?: Record<string, unknown>; required?: string[] };
      for (const [name, schema] of Object.entries(q.properties ?? {})) params.push({ name, in: "query", required: q.required?.includes(name) ?? false, schema: schema as { type: string } });
    }
    if (op.ifMatch) params.push({ name: "If-Match", in: "header", required: true, schema: { type: "string" } });
    paths[op.path] ??= {};
    paths[op.path][op.method] = {
      summary: op.summary,
      description: `Who may call it: ${op.access}.`,
      ...(params.length ? { parameters: params } : {}),
      ...(op.body ? { requestBody: { required: true, content: { "application/json": { schema: schemaOf(op.body) } } } } : {}),
      responses: Object.fromEntries(
        Object.entries(op.responses).map(([code, description]) => [
          code,
          { description, ...(Number(code) >= 400 ? { content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } } : {}) },
        ]),
      ),
    };
  }
  return {
    openapi: "3.0.3",
    info: {
      title: "Ampwright API",
      version: "1",
      description: "Jobs, circuits, revisions and readings of a shop or class; the solver and cable sizing. Sign in with the session cookie. SI units inside.",
    },
    paths,
    components: {
      schemas: {
        CircuitDocument: schemaOf(circuitSchemaV1),
        Error: {
          type: "object",
          required: ["error"],
          properties: {
            error: {
              type: "object",
              required: ["code", "message"],
              properties: {
                code: { type: "string" },
                message: { type: "string" },
                issues: { type: "array", items: { type: "object", properties: { path: { type: "string" }, message: { type: "string" } } } },
              },
            },
          },
        },
      },
    },
  };
}
