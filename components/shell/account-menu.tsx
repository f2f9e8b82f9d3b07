"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { authClient } from "@/lib/auth/client";
import { useMyOrganizations } from "@/lib/hooks/organizations";
import { apiFetch } from "@/lib/query/client";

/** Who is signed in, which shop or class they work in, and the way out; or the way in. */
export function AccountMenu() {
  const router = useRouter();
  const { data, isPending, refetch } = authClient.useSession();
  const orgs = useMyOrganizations(Boolean(data));
  if (isPending) return <span className="h-8 w-20" aria-hidden="true" />;
  if (!data) {
    return (
      <Link href="/sign-in" className="rounded-md border border-graphite-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-graphite-800" data-testid="header-sign-in">
        Sign in
      </Link>
    );
  }
  const active = data.session.activeOrganizationId ?? orgs.data?.[0]?.organizationId ?? "";
  return (
    <div className="flex items-center gap-2 text-sm">
      {orgs.data && orgs.data.length > 0 ? (
        <label className="hidden items-center gap-1 md:flex">
          <span className="sr-only">Working in</span>
          <select
            value={active}
            onChange={async (e) => {
              await apiFetch(`/api/v1/organizations/${encodeURIComponent(e.target.value)}/activate`, { method: "POST" });
              await refetch();
              router.refresh();
            }}
            className="max-w-56 rounded-md border border-graphite-700 bg-graphite-800 px-2 py-1.5 text-graphite-100"
            data-testid="header-org"
          >
            {orgs.data.map((o) => (
              <option key={o.organizationId} value={o.organizationId}>
                {o.name} ({o.roleLabel})
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <Link href="/account" className="hidden px-1 text-graphite-300 hover:text-white sm:inline" data-testid="header-user">
        {data.user.name}
      </Link>
      <Link href="/organizations" className="hidden px-1 text-graphite-300 hover:text-white lg:inline">
        Shops &amp; classes
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
