"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { areas } from "@/lib/areas";
import { AccountMenu } from "./account-menu";
import { Logo } from "./logo";

export function SiteHeader() {
  const pathname = usePathname();
  return (
    <header className="bg-graphite-900 text-graphite-100 print:hidden">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-8 gap-y-2 px-4 py-3 sm:px-6">
        <Link href="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight text-white" data-testid="home-link">
          <Logo className="h-7 w-7" />
          Ampwright
        </Link>
        <nav aria-label="Main" className="-mx-1 flex min-w-0 flex-1 gap-1 overflow-x-auto">
          {areas.map((area) => {
            const active = pathname === area.href || pathname.startsWith(`${area.href}/`);
            return (
              <Link
                key={area.href}
                href={area.href}
                aria-current={active ? "page" : undefined}
                className={`whitespace-nowrap rounded-md px-3 py-2 text-sm font-medium transition-colors ${
                  active ? "bg-graphite-700 text-white" : "text-graphite-300 hover:bg-graphite-800 hover:text-white"
                }`}
              >
                {area.label}
              </Link>
            );
          })}
        </nav>
        <AccountMenu />
      </div>
    </header>
  );
}
