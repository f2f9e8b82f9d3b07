import { db } from "@/db";
import { createJob, getJob, listJobs } from "@/db/queries/work";
import { userRoute } from "@/lib/api/authed";
import { ApiError } from "@/lib/api/errors";
import { parseQuery } from "@/lib/api/route";
import { chooseOrganization, workRights } from "@/lib/api/work";
import { decodeCursor, encodeCursor } from "@/lib/api/work-responses";
import { can } from "@/lib/auth/permissions";
import { createJobInput, listJobsQuery, MAX_WORK_BYTES } from "@/lib/validators/work";

// GET /api/v1/jobs - a page of the organisation's jobs (search q, status, sort, dir, limit, cursor)
export const GET = userRoute({}, async ({ req, user }) => {
  const q = parseQuery(req, listJobsQuery);
  const membership = await chooseOrganization(user, q.organizationId);
  const seesAll = can(membership.role, "work.read.all");
  if (!seesAll && !can(membership.role, "work.read.own")) throw new ApiError(403, "forbidden", `Your role (${membership.role}) cannot see jobs in ${membership.name}.`);
  const dir = q.dir ?? (q.sort === "title" || q.sort === "status" ? "asc" : "desc");
  const page = await listJobs(db, {
    organizationId: membership.organizationId,
    ownerId: seesAll ? undefined : user.id,
    q: q.q || undefined,
    status: q.status,
    sort: q.sort,
    dir,
    limit: q.limit,
    after: decodeCursor(q.cursor, q.sort === "updated" || q.sort === "created" ? "timestamp" : "text"),
  });
  return Response.json({
    organization: { id: membership.organizationId, name: membership.name, kind: membership.kind, role: membership.role },
    canCreate: can(membership.role, "work.create"),
    jobs: page.jobs.map((j) => ({ ...j, canEdit: workRights(membership.role, j.ownerId === user.id).edit })),
    nextCursor: page.next ? encodeCursor(page.next) : null,
  });
});

// POST /api/v1/jobs - open a job in the organisation (work.create)
export const POST = userRoute({ body: createJobInput, maxBytes: MAX_WORK_BYTES }, async ({ body, user }) => {
  const membership = await chooseOrganization(user, body.organizationId);
  if (!can(membership.role, "work.create")) {
    throw new ApiError(403, "forbidden", `Your role (${membership.role}) in ${membership.name} cannot open jobs. Ask an owner or lead.`);
  }
  const { organizationId: _org, ...fields } = body;
  void _org;
  const id = await createJob(db, { ...fields, organizationId: membership.organizationId, userId: user.id });
  const job = await getJob(db, id);
  return Response.json({ job: { ...job, canEdit: true } }, { status: 201, headers: { location: `/api/v1/jobs/${id}` } });
});
