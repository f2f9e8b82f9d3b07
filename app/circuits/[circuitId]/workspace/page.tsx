import type { Metadata } from "next";
import { Workspace } from "@/components/workspace/workspace";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Workspace" };

export default async function Page({ params, searchParams }: { params: Promise<{ circuitId: string }>; searchParams: Promise<{ focus?: string; state?: string; readings?: string }> }) {
  const { circuitId } = await params;
  const q = await searchParams;
  await requireUser(`/circuits/${circuitId}/workspace`);
  const focus = typeof q.focus === "string" && q.focus ? q.focus.split(",").slice(0, 20) : undefined;
  return <Workspace circuitId={circuitId} focus={focus} state={typeof q.state === "string" ? q.state : undefined} readings={q.readings === "1"} />;
}
