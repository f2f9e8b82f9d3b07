import { db } from "@/db";
import { countAttempt } from "@/db/queries/abuse";
import { enqueueMail } from "@/db/queries/mail";
import { loadReportInput } from "@/db/queries/report";
import { createShareLink } from "@/db/queries/sharing";
import { audit } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { env } from "@/lib/env";
import { kickMailWorker } from "@/lib/mail/sender";
import { reportMessage } from "@/lib/mail/templates";
import { slugOf } from "@/lib/report/files";
import { buildJobReport, reportText } from "@/lib/report/job-report";
import { reportPdf } from "@/lib/report/pdf";
import { emailReportInput } from "@/lib/validators/sharing";

/** Reports one person may send in an hour (a guard against a stolen session used to send mail). */
const REPORT_MAIL_PER_HOUR = 20;

// POST /api/v1/jobs/:jobId/report/email - send the report as a PDF (and, if asked, a read-only link) through the outbox
export const POST = workRoute({ resource: "job", need: "edit", body: emailReportInput }, async ({ target, user, membership, body }) => {
  const n = await countAttempt(db, `report-mail|${user.id}`, 3600);
  if (n > REPORT_MAIL_PER_HOUR) throw new ApiError(429, "too-many", `You have sent ${REPORT_MAIL_PER_HOUR} reports in the last hour; wait a while before sending more.`);
  const input = await loadReportInput(db, target.jobId);
  if (!input) throw new ApiError(404, "not-found", "There is no such job.");
  const report = buildJobReport(input);
  const pdf = await reportPdf(report);
  let url: string | undefined;
  let linkId: string | undefined;
  if (body.linkDays) {
    const made = await createShareLink(db, {
      jobId: target.jobId,
      organizationId: target.organizationId,
      userId: user.id,
      label: `E-mailed to ${body.to}`,
      expiresAt: new Date(Date.now() + body.linkDays * 86_400_000),
    });
    url = `${env().APP_URL}/shared/${made.token}`;
    linkId = made.id;
  }
  const message = reportMessage({ sender: user.name || user.email, organization: membership.name, title: report.title, note: body.message, summary: reportText(report, url), url });
  await db.transaction(async (tx) => {
    await enqueueMail(tx, {
      to: body.to,
      ...message,
      kind: "job-report",
      attachments: [{ filename: `${slugOf(report.title)}-report.pdf`, contentType: "application/pdf", contentBase64: pdf.toString("base64") }],
    });
    await audit(tx, { organizationId: target.organizationId, actorId: user.id, action: "report.email", entityType: "job", entityId: target.jobId, detail: { to: body.to, linkId: linkId ?? null } });
  });
  kickMailWorker();
  return Response.json({ queued: true, to: body.to, pdfBytes: pdf.length, linkId: linkId ?? null }, { status: 202 });
});
