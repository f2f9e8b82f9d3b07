import { db } from "@/db";
import { loadReportInput } from "@/db/queries/report";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { downloadHeaders, slugOf } from "@/lib/report/files";
import { buildJobReport } from "@/lib/report/job-report";
import { reportPdf } from "@/lib/report/pdf";

// GET /api/v1/jobs/:jobId/report.pdf - the job report as a PDF made on the server (?inline=1 to view in the browser)
export const GET = workRoute({ resource: "job", need: "read" }, async ({ target, req }) => {
  const input = await loadReportInput(db, target.jobId);
  if (!input) throw new ApiError(404, "not-found", "There is no such job.");
  const report = buildJobReport(input);
  const pdf = await reportPdf(report);
  const inline = new URL(req.url).searchParams.get("inline") === "1";
  return new Response(new Uint8Array(pdf), { headers: downloadHeaders("application/pdf", `${slugOf(report.title)}-report.pdf`, inline) });
});
