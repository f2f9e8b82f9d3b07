import type { Metadata } from "next";
import { JobDetail } from "@/components/jobs/job-detail";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Job" };

export default async function Page({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  await requireUser(`/jobs/${jobId}`);
  return (
    <div className="mx-auto max-w-5xl px-4 py-8 sm:px-6">
      <JobDetail id={jobId} />
    </div>
  );
}
