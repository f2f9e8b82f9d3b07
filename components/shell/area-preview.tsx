import Link from "next/link";
import type { Area } from "@/lib/areas";

/** What an area will hold, said plainly until it is built. */
export function AreaPreview({ area }: { area: Area }) {
  return (
    <div className="mx-auto max-w-3xl px-4 py-10 sm:px-6" data-testid="area-preview">
      <p className="text-sm font-semibold uppercase tracking-wider text-copper-600">{area.label}</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight">{area.summary}</h1>
      <div className="mt-6 rounded-lg border border-graphite-100 bg-paper-raised p-5">
        <p className="font-medium">Being built. When this area opens you will be able to:</p>
        <ul className="mt-3 list-disc space-y-2 pl-5 text-graphite-700">
          {area.coming.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </div>
      <p className="mt-6 text-sm text-graphite-500">
        <Link href="/" className="font-medium text-copper-700 underline underline-offset-2">
          Back to the start page
        </Link>
      </p>
    </div>
  );
}
