import Link from "next/link";

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-graphite-100 bg-paper-raised print:hidden">
      <div className="mx-auto max-w-7xl px-4 py-6 text-sm text-graphite-500 sm:px-6">
        <p>
          Ampwright models circuits to guide measurement; it does not replace it. The vehicle maker&rsquo;s service
          information, local codes and licensed practice come first.{" "}
          <Link href="/privacy" className="underline underline-offset-2">
            Privacy
          </Link>{" "}
          ·{" "}
          <Link href="/api-reference" className="underline underline-offset-2">
            API
          </Link>
        </p>
      </div>
    </footer>
  );
}
