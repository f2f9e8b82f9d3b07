import "server-only";
import { db } from "@/db";
import { loadReportInput } from "@/db/queries/report";
import { openShareLink } from "@/db/queries/sharing";
import { buildJobReport, type JobReport } from "./job-report";
import { looksLikeShareToken } from "./tokens";

/**
 * The report a share token opens, or undefined (answered as 404) when the token is malformed, unknown, revoked or
 * expired. A link to one circuit shows that circuit with the job's title and vehicle, and nothing else of the job.
 */
export async function sharedReport(token: string): Promise<JobReport | undefined> {
  if (!looksLikeShareToken(token)) return undefined;
  const link = await openShareLink(db, token);
  if (!link) return undefined;
  const input = await loadReportInput(db, link.jobId, link.circuitId ? { circuitId: link.circuitId } : undefined);
  if (!input) return undefined;
  if (link.circuitId) input.job = { ...input.job, complaint: "", findings: "", repair: "" };
  return buildJobReport(input);
}
