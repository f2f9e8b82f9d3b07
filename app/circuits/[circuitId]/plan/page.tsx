import type { Metadata } from "next";
import { PlanRunner } from "@/components/diagnosis/plan-runner";
import { db } from "@/db";
import { getLimits } from "@/db/queries/limits";
import { listOwnPlans } from "@/db/queries/plans";
import { circuitAccess } from "@/db/queries/work";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Test plan" };

export default async function Page({ params, searchParams }: { params: Promise<{ circuitId: string }>; searchParams: Promise<{ plan?: string }> }) {
  const { circuitId } = await params;
  const { plan } = await searchParams;
  const user = await requireUser(`/circuits/${circuitId}/plan`);
  // The organisation's own limits judge the readings; whether the circuit may be seen at all is the API's answer.
  const access = await circuitAccess(db, circuitId, user.id);
  const own = access?.role ? await getLimits(db, access.organizationId) : undefined;
  const ownPlans = access?.role ? (await listOwnPlans(db, access.organizationId)).map((p) => p.plan) : [];
  return (
    <div className="px-4 py-8 sm:px-6">
      <PlanRunner
        circuitId={circuitId}
        planId={typeof plan === "string" ? plan : undefined}
        limits={own?.limits}
        ownPlans={ownPlans}
        limitsNote={own && Object.keys(own.own).length ? `${access!.organizationName}'s own limits are in force for ${Object.keys(own.own).length} of the figures.` : undefined}
      />
    </div>
  );
}
