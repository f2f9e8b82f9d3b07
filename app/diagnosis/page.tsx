import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { SafetyNote } from "@/components/ui/safety-note";
import { db } from "@/db";
import { getLimits } from "@/db/queries/limits";
import { findMembership, listMemberships } from "@/db/queries/organizations";
import { listOwnPlans } from "@/db/queries/plans";
import { listRecentCircuits } from "@/db/queries/work";
import { can } from "@/lib/auth/permissions";
import { auth } from "@/lib/auth/server";
import { requireUser } from "@/lib/auth/session";
import { BUILT_IN_PLANS } from "@/lib/diagnosis/plans";
import { formatWhen } from "@/lib/format";

export const metadata: Metadata = { title: "Diagnosis" };

const METHOD = [
  ["Battery first", "Read the battery at rest. Below about 75 % charged, charge and test it before judging anything else."],
  ["Then the feeds", "Check that battery voltage reaches the alternator or starter with the key on."],
  ["Then the drops, under load", "Measure the positive side and the ground side with current flowing; a side over its limit hides a bad cable or joint."],
  ["Then the part", "Measure across each part of a failing side until one stands out; only a circuit proven sound condemns the unit itself."],
] as const;

/** Diagnosis: the method, the test plans (built-in and the organisation's own) and the circuits to run them on. */
export default async function Page() {
  const user = await requireUser("/diagnosis");
  const session = await auth.api.getSession({ headers: await headers() });
  const orgId = session?.session.activeOrganizationId ?? (await listMemberships(db, user.id))[0]?.organizationId;
  const membership = orgId ? await findMembership(db, { userId: user.id, organizationId: orgId }) : undefined;
  const ownerId = membership && !can(membership.role, "work.read.all") ? user.id : undefined;
  const [recent, ownPlans, limits] = membership
    ? await Promise.all([
        listRecentCircuits(db, { organizationId: membership.organizationId, ownerId, limit: 10 }),
        listOwnPlans(db, membership.organizationId),
        getLimits(db, membership.organizationId),
      ])
    : [[], [], undefined];
  const plans = [...BUILT_IN_PLANS, ...ownPlans.map((p) => p.plan)];
  return (
    <div className="mx-auto max-w-6xl px-4 py-8 sm:px-6">
      <h1 className="text-3xl font-semibold tracking-tight" data-testid="diagnosis-heading">
        Diagnosis
      </h1>
      <p className="mt-1 max-w-3xl text-graphite-700">
        Prove where the fault is before buying parts: each reading is compared with what the circuit predicts, and a test plan walks you through the checks in the order that proves it.
      </p>
      <ol className="mt-6 grid gap-3 sm:grid-cols-2 lg:grid-cols-4" data-testid="diagnosis-method">
        {METHOD.map(([title, text], i) => (
          <li key={title} className="rounded-lg border border-graphite-100 bg-paper-raised p-4">
            <p className="text-xs font-semibold uppercase tracking-wider text-copper-600">Step {i + 1}</p>
            <p className="mt-1 font-semibold">{title}</p>
            <p className="mt-1 text-sm text-graphite-700">{text}</p>
          </li>
        ))}
      </ol>
      <div className="mt-8 grid gap-8 lg:grid-cols-[1fr_1fr]">
        <section aria-labelledby="run-h">
          <h2 id="run-h" className="text-xl font-semibold">
            Run a test plan on a circuit
          </h2>
          {recent.length ? (
            <ul className="mt-3 divide-y divide-graphite-100 rounded-lg border border-graphite-100 bg-paper-raised" data-testid="diagnosis-circuits">
              {recent.map((c) => (
                <li key={c.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3">
                  <div className="min-w-0">
                    <p className="font-semibold">{c.name}</p>
                    <p className="truncate text-sm text-graphite-700">
                      {c.jobTitle} · {formatWhen(c.updatedAt)}
                    </p>
                  </div>
                  <Link href={`/circuits/${c.id}/plan`} className="shrink-0 rounded-md border border-copper-600 px-3 py-1.5 text-sm font-medium text-copper-700 hover:bg-copper-50">
                    Test plan
                  </Link>
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-3 rounded-lg border border-graphite-100 bg-paper-raised px-4 py-5 text-graphite-700">
              No circuits yet. Open a{" "}
              <Link href="/jobs" className="text-copper-700 underline">
                job
              </Link>{" "}
              and draw the circuit you are about to test.
            </p>
          )}
        </section>
        <section aria-labelledby="plans-h">
          <h2 id="plans-h" className="text-xl font-semibold">
            Test plans
          </h2>
          <ul className="mt-3 space-y-2" data-testid="diagnosis-plans">
            {plans.map((p) => (
              <li key={p.id} className="rounded-lg border border-graphite-100 bg-paper-raised px-4 py-3">
                <p className="font-semibold">{p.name}</p>
                <p className="text-sm text-graphite-700">
                  {p.complaint} · {p.steps.length} checks
                </p>
              </li>
            ))}
          </ul>
          {membership ? (
            <p className="mt-3 text-sm text-graphite-700">
              {limits && Object.keys(limits.own).length
                ? `${membership.name} has set ${Object.keys(limits.own).length} ${Object.keys(limits.own).length === 1 ? "limit" : "limits"} of its own. `
                : "The limits are common practice. "}
              <Link href={`/organizations/${membership.organizationId}`} className="text-copper-700 underline">
                {can(membership.role, "limits.set") ? "Change the limits or add a plan" : "See the limits"}
              </Link>
              .
            </p>
          ) : null}
        </section>
      </div>
      <div className="mt-8">
        <SafetyNote compact />
      </div>
    </div>
  );
}
