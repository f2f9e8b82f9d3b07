import { errorResponse } from "@/lib/api/errors";
import { downloadHeaders, slugOf } from "@/lib/report/files";
import { reportPdf } from "@/lib/report/pdf";
import { sharedReport } from "@/lib/report/shared";

// GET /shared/:token/report.pdf - the shared report as a PDF; 404 for a revoked, expired or unknown link
export async function GET(_req: Request, { params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const report = await sharedReport(token);
  if (!report) return errorResponse(404, "not-found", "This link does not exist, has expired or was revoked.");
  const pdf = await reportPdf(report);
  return new Response(new Uint8Array(pdf), { headers: { ...downloadHeaders("application/pdf", `${slugOf(report.title)}-report.pdf`), "x-robots-tag": "noindex, nofollow" } });
}
