import type { Metadata } from "next";
import { Workspace } from "@/components/workspace/workspace";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Workspace" };

export default async function Page({ params }: { params: Promise<{ circuitId: string }> }) {
  const { circuitId } = await params;
  await requireUser(`/circuits/${circuitId}/workspace`);
  return <Workspace circuitId={circuitId} />;
}
