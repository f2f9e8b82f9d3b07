"use client";

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="mx-auto max-w-2xl px-4 py-16 sm:px-6" role="alert">
      <p className="font-mono text-sm text-over">Something went wrong</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight">This page could not be shown.</h1>
      <p className="mt-4 text-graphite-700">
        Nothing you saved has been lost. Try again; if it keeps happening, note what you were doing and tell whoever
        runs Ampwright for your shop.
      </p>
      <button
        type="button"
        onClick={reset}
        className="mt-8 rounded-md bg-graphite-900 px-4 py-2 font-medium text-white hover:bg-graphite-700"
      >
        Try again
      </button>
    </div>
  );
}
