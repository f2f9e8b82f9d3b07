import type { Metadata } from "next";
import Link from "next/link";
import { CreateOrganizationForm } from "@/components/organizations/create-organization-form";
import { db } from "@/db";
import { listMemberships } from "@/db/queries/organizations";
import { roleLabel } from "@/lib/auth/permissions";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Shops and classes" };

export default async function Page() {
  const user = await requireUser("/organizations");
  const rows = await listMemberships(db, user.id);
  return (
    <div className="mx-auto max-w-4xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-semibold tracking-tight">Shops and classes</h1>
      <p className="mt-2 text-graphite-700">Each keeps its own jobs, circuits and people. You can belong to several.</p>
      <ul className="mt-6 divide-y divide-graphite-100 rounded-lg border border-graphite-100 bg-paper-raised" data-testid="org-list">
        {rows.map((r) => (
          <li key={r.organizationId}>
            <Link href={`/organizations/${r.organizationId}`} className="flex items-center justify-between gap-4 px-5 py-4 hover:bg-copper-50">
              <span>
                <span className="font-semibold">{r.name}</span>
                <span className="ml-2 rounded bg-graphite-100 px-2 py-0.5 text-xs uppercase tracking-wide text-graphite-700">{r.kind}</span>
              </span>
              <span className="text-sm text-graphite-700">{roleLabel(r.kind, r.role)}</span>
            </Link>
          </li>
        ))}
      </ul>
      <h2 className="mt-10 text-xl font-semibold">Start a new one</h2>
      <div className="mt-4 rounded-lg border border-graphite-100 bg-paper-raised p-5">
        <CreateOrganizationForm />
      </div>
    </div>
  );
}
