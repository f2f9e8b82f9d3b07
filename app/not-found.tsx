import Link from "next/link";

export default function NotFound() {
  return (
    <div className="mx-auto max-w-2xl px-4 py-16 sm:px-6" data-testid="not-found">
      <p className="font-mono text-sm text-copper-600">404 · open circuit</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight">There is nothing at this address.</h1>
      <p className="mt-4 text-graphite-700">
        The link may be old, or the job or circuit may belong to an organisation you are not a member of.
      </p>
      <Link href="/" className="mt-8 inline-block rounded-md bg-graphite-900 px-4 py-2 font-medium text-white hover:bg-graphite-700">
        Go to the start page
      </Link>
    </div>
  );
}
