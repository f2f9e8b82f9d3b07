import Link from "next/link";

/** A record that cannot be shown (gone, or not the caller's to see): why, and the way back to the jobs list. */
export function Unavailable({ title, message, testId, className = "" }: { title: string; message: string; testId?: string; className?: string }) {
  return (
    <div role="alert" data-testid={testId} className={className}>
      <h1 className="text-2xl font-semibold">{title}</h1>
      <p className="mt-2 text-graphite-700">{message}</p>
      <Link href="/jobs" className="mt-4 inline-block font-medium text-copper-700 underline">
        Back to the jobs list
      </Link>
    </div>
  );
}
