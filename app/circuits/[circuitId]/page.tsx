import type { Metadata } from "next";
import { CircuitView } from "@/components/circuits/circuit-view";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Circuit" };

export default async function Page({ params }: { params: Promise<{ circuitId: string }> }) {
  const { circuitId } = await params;
  await requireUser(`/circuits/${circuitId}`);
  return (
    <div className="mx-auto max-w-7xl px-4 py-8 sm:px-6">
      <CircuitView id={circuitId} />
    </div>
  );
}
