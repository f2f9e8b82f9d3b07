"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { IssueList } from "@/components/jobs/job-detail";
import { Field } from "@/components/ui/field";
import { useEmailReport } from "@/lib/hooks/sharing";
import { emailReportInput, type EmailReportInput } from "@/lib/validators/sharing";

const secondary = "rounded-md border border-graphite-300 bg-white px-3 py-1.5 text-sm font-medium hover:bg-graphite-100";

/** Above the report on screen (never on paper): back to the job, print, the PDF, and sending it by e-mail. */
export function ReportActions({ jobId, canEdit }: { jobId: string; canEdit: boolean }) {
  const [mailing, setMailing] = useState(false);
  return (
    <div className="mx-auto max-w-4xl px-6 pt-6 print:hidden">
      <div className="flex flex-wrap items-center gap-2">
        <Link href={`/jobs/${jobId}`} className="mr-auto text-sm font-medium text-copper-700 underline-offset-2 hover:underline" data-testid="report-back">
          ← Back to the job
        </Link>
        <button type="button" className={secondary} onClick={() => window.print()} data-testid="report-print">
          Print
        </button>
        <a href={`/api/v1/jobs/${jobId}/report.pdf`} className={secondary} data-testid="report-pdf">
          Download PDF
        </a>
        {canEdit ? (
          <button type="button" className="rounded-md bg-copper-600 px-3 py-1.5 text-sm font-semibold text-white hover:bg-copper-700" onClick={() => setMailing((m) => !m)} aria-expanded={mailing} data-testid="report-email-open">
            E-mail…
          </button>
        ) : null}
      </div>
      {mailing ? <EmailForm jobId={jobId} onDone={() => setMailing(false)} /> : null}
    </div>
  );
}

function EmailForm({ jobId, onDone }: { jobId: string; onDone: () => void }) {
  const send = useEmailReport(jobId);
  const form = useForm<EmailReportInput>({ resolver: zodResolver(emailReportInput), defaultValues: { to: "", message: "", linkDays: null } });
  const [withLink, setWithLink] = useState(false);
  const errors = form.formState.errors;
  return (
    <form
      className="mt-3 grid gap-3 rounded-lg border border-graphite-100 bg-paper-raised p-4"
      onSubmit={form.handleSubmit((v) => send.mutate({ ...v, linkDays: withLink ? 14 : null }))}
      noValidate
      data-testid="report-email-form"
    >
      <Field label="Send to" type="email" autoComplete="email" registration={form.register("to")} error={errors.to?.message} testId="report-email-to" hint="The customer, the service writer or the next shift." />
      <label className="text-sm font-medium text-graphite-800">
        Note (optional)
        <textarea className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2" rows={3} {...form.register("message")} data-testid="report-email-message" />
        {errors.message ? <span className="mt-1 block text-sm text-over">{errors.message.message}</span> : null}
      </label>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={withLink} onChange={(e) => setWithLink(e.target.checked)} data-testid="report-email-link" />
        Also include a read-only link that works for 14 days (you can revoke it from the job)
      </label>
      <div className="flex flex-wrap items-center gap-2">
        <button type="submit" disabled={send.isPending} className="rounded-md bg-copper-600 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-700 disabled:opacity-50" data-testid="report-email-send">
          {send.isPending ? "Sending…" : "Send the report"}
        </button>
        <button type="button" className={secondary} onClick={onDone}>
          Close
        </button>
        {send.isSuccess ? (
          <p className="text-sm text-within" role="status" data-testid="report-email-sent">
            Queued for {send.data.to}: the PDF goes out within a few seconds.
          </p>
        ) : null}
      </div>
      <IssueList error={send.error} />
    </form>
  );
}
