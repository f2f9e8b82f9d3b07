import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ReportActions } from "@/components/report/report-actions";
import { ReportView } from "@/components/report/report-view";
import { db } from "@/db";
import { loadReportInput } from "@/db/queries/report";
import { jobAccess } from "@/db/queries/work";
import { workRights } from "@/lib/api/work";
import { requireUser } from "@/lib/auth/session";
import { buildJobReport } from "@/lib/report/job-report";

export const metadata: Metadata = { title: "Job report" };

export default async function Page({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  const user = await requireUser(`/jobs/${jobId}/report`);
  const access = await jobAccess(db, jobId, user.id);
  const rights = access?.role ? workRights(access.role, access.ownerId === user.id) : undefined;
  if (!rights?.read) notFound();
  const input = await loadReportInput(db, jobId);
  if (!input) notFound();
  return (
    <>
      <ReportActions jobId={jobId} canEdit={rights.edit} />
      <ReportView report={buildJobReport(input)} />
    </>
  );
}
