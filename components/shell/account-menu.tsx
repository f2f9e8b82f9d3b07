"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { authClient } from "@/lib/auth/client";

/** Who is signed in, and the way out; or the way in. */
export function AccountMenu() {
  const router = useRouter();
  const { data, isPending } = authClient.useSession();
  if (isPending) return <span className="h-8 w-20" aria-hidden="true" />;
  if (!data) {
    return (
      <Link href="/sign-in" className="rounded-md border border-graphite-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-graphite-800" data-testid="header-sign-in">
        Sign in
      </Link>
    );
  }
  return (
    <div className="flex items-center gap-3 text-sm">
      <Link href="/organizations" className="hidden text-graphite-300 hover:text-white sm:inline" data-testid="header-user">
        {data.user.name}
      </Link>
      <button
        type="button"
        className="rounded-md border border-graphite-700 px-3 py-1.5 font-medium text-white hover:bg-graphite-800"
        onClick={async () => {
          await authClient.signOut();
          router.push("/");
          router.refresh();
        }}
        data-testid="header-sign-out"
      >
        Sign out
      </button>
    </div>
  );
}
