import type { Metadata } from "next";
import { CircuitHistory } from "@/components/circuits/circuit-history";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Circuit history" };

export default async function Page({ params }: { params: Promise<{ circuitId: string }> }) {
  const { circuitId } = await params;
  await requireUser(`/circuits/${circuitId}/history`);
  return (
    <div className="mx-auto max-w-7xl px-4 py-8 sm:px-6">
      <CircuitHistory id={circuitId} />
    </div>
  );
}
