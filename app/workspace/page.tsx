import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { StartCircuit } from "@/components/workspace/start-circuit";
import { db } from "@/db";
import { findMembership, listMemberships } from "@/db/queries/organizations";
import { listJobs, listRecentCircuits } from "@/db/queries/work";
import { workRights } from "@/lib/api/work";
import { can } from "@/lib/auth/permissions";
import { auth } from "@/lib/auth/server";
import { requireUser } from "@/lib/auth/session";
import { formatWhen } from "@/lib/format";

export const metadata: Metadata = { title: "Circuits" };

export default async function Page() {
  const user = await requireUser("/workspace");
  const session = await auth.api.getSession({ headers: await headers() });
  const orgId = session?.session.activeOrganizationId ?? (await listMemberships(db, user.id))[0]?.organizationId;
  const membership = orgId ? await findMembership(db, { userId: user.id, organizationId: orgId }) : undefined;
  const seesAll = membership ? can(membership.role, "work.read.all") : false;
  const ownerId = seesAll ? undefined : user.id;
  const [recent, jobPage] = membership
    ? await Promise.all([
        listRecentCircuits(db, { organizationId: membership.organizationId, ownerId, limit: 12 }),
        listJobs(db, { organizationId: membership.organizationId, ownerId, sort: "updated", dir: "desc", limit: 50 }),
      ])
    : [[], { jobs: [] }];
  const editable = membership ? jobPage.jobs.filter((j) => workRights(membership.role, j.ownerId === user.id).edit && j.status !== "closed") : [];
  return (
    <div className="mx-auto max-w-6xl px-4 py-8 sm:px-6">
      <h1 className="text-3xl font-semibold tracking-tight">Circuits</h1>
      <p className="mt-1 text-graphite-700">Sketch a charging or starting circuit and see every voltage, current and drop as you draw. {membership ? `Working in ${membership.name}.` : ""}</p>
      <div className="mt-8 grid gap-8 lg:grid-cols-[1fr_1fr]">
        <section aria-labelledby="recent-h">
          <h2 id="recent-h" className="text-xl font-semibold">
            Recently saved
          </h2>
          {recent.length ? (
            <ul className="mt-3 divide-y divide-graphite-100 rounded-lg border border-graphite-100 bg-paper-raised" data-testid="recent-circuits">
              {recent.map((c) => (
                <li key={c.id} className="flex items-center justify-between gap-3 px-4 py-3">
                  <div className="min-w-0">
                    <Link href={`/circuits/${c.id}/workspace`} className="font-semibold text-copper-700 underline-offset-2 hover:underline">
                      {c.name}
                    </Link>
                    <p className="truncate text-sm text-graphite-700">
                      {c.jobTitle} · {c.components} parts · version {c.version}, {formatWhen(c.updatedAt)}
                    </p>
                  </div>
                  <Link href={`/circuits/${c.id}`} className="shrink-0 text-sm text-graphite-700 underline-offset-2 hover:underline">
                    Readings
                  </Link>
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-3 rounded-lg border border-graphite-100 bg-paper-raised px-4 py-5 text-graphite-700">No circuits yet in this organisation.</p>
          )}
        </section>
        <section aria-labelledby="start-h" className="rounded-lg border border-graphite-100 bg-paper-raised p-5">
          <h2 id="start-h" className="text-xl font-semibold">
            Start a circuit
          </h2>
          <div className="mt-3">
            <StartCircuit jobs={editable.map((j) => ({ id: j.id, title: j.title, systemVoltage: j.systemVoltage }))} />
          </div>
        </section>
      </div>
    </div>
  );
}
