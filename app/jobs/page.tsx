import type { Metadata } from "next";
import { JobsTable } from "@/components/jobs/jobs-table";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Jobs" };

export default async function Page() {
  await requireUser("/jobs");
  return (
    <div className="mx-auto max-w-7xl px-4 py-8 sm:px-6">
      <JobsTable />
    </div>
  );
}
