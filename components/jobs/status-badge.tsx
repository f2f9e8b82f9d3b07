import { STATUS_LABELS } from "@/lib/format";
import type { JobStatus } from "@/lib/validators/work";

const tone: Record<JobStatus, string> = {
  open: "border-graphite-300 bg-white text-graphite-800",
  diagnosed: "border-caution/40 bg-caution-soft text-caution",
  repaired: "border-within/40 bg-within-soft text-within",
  closed: "border-graphite-100 bg-graphite-100 text-graphite-700",
};

/** A job's status as a word in a tinted box: the word carries the meaning, the tint only helps. */
export function StatusBadge({ status }: { status: JobStatus }) {
  return <span className={`inline-block rounded border px-2 py-0.5 text-xs font-semibold uppercase tracking-wide ${tone[status]}`}>{STATUS_LABELS[status]}</span>;
}
