import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ReportView } from "@/components/report/report-view";
import { sharedReport } from "@/lib/report/shared";

// Shared pages are for the people given the link, never for search engines.
export const metadata: Metadata = { title: "Shared report", robots: { index: false, follow: false, nocache: true } };

export default async function Page({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const report = await sharedReport(token);
  if (!report) notFound();
  return (
    <>
      <div className="mx-auto flex max-w-4xl flex-wrap items-center justify-between gap-2 px-6 pt-6 text-sm print:hidden">
        <p className="text-graphite-700">Shared with you by {report.organizationName}. Read only; no sign-in needed.</p>
        <a href={`/shared/${token}/report.pdf`} className="rounded-md border border-graphite-300 bg-white px-3 py-1.5 font-medium hover:bg-graphite-100" data-testid="shared-pdf">
          Download PDF
        </a>
      </div>
      <ReportView report={report} shared />
    </>
  );
}
