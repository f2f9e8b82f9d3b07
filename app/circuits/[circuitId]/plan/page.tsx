import type { Metadata } from "next";
import { PlanRunner } from "@/components/diagnosis/plan-runner";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Test plan" };

export default async function Page({ params, searchParams }: { params: Promise<{ circuitId: string }>; searchParams: Promise<{ plan?: string }> }) {
  const { circuitId } = await params;
  const { plan } = await searchParams;
  await requireUser(`/circuits/${circuitId}/plan`);
  return (
    <div className="px-4 py-8 sm:px-6">
      <PlanRunner circuitId={circuitId} planId={typeof plan === "string" ? plan : undefined} />
    </div>
  );
}
