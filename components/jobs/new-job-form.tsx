"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormError } from "@/components/ui/field";
import { useCreateJob } from "@/lib/hooks/jobs";
import { createJobInput, type CreateJobInput } from "@/lib/validators/work";

/** Opens a job in the organisation being worked in, then goes to it. */
export function NewJobForm({ organizationId, onCancel }: { organizationId: string; onCancel?: () => void }) {
  const router = useRouter();
  const form = useForm<CreateJobInput>({
    resolver: zodResolver(createJobInput),
    defaultValues: { organizationId, title: "", vehicle: "", complaint: "", systemVoltage: 12 },
  });
  const create = useCreateJob();
  const errors = form.formState.errors;
  return (
    <form
      onSubmit={form.handleSubmit((v) => create.mutate(v, { onSuccess: (res) => router.push(`/jobs/${res.job.id}`) }))}
      className="grid gap-4 sm:grid-cols-2"
      noValidate
      data-testid="new-job-form"
    >
      <Field label="Title" registration={form.register("title")} error={errors.title?.message} testId="job-title" hint='What the job is about, e.g. "Battery light at idle"' />
      <Field label="Vehicle" registration={form.register("vehicle")} error={errors.vehicle?.message} testId="job-vehicle" hint="Unit number, body, engine, alternator rating" />
      <div className="sm:col-span-2">
        <label htmlFor="f-complaint" className="block text-sm font-medium text-graphite-800">
          Complaint
        </label>
        <textarea
          id="f-complaint"
          rows={3}
          className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2"
          placeholder="What the driver or customer reports, in their words"
          data-testid="job-complaint"
          {...form.register("complaint")}
        />
        {errors.complaint ? <p className="mt-1 text-sm text-over">{errors.complaint.message}</p> : null}
      </div>
      <div>
        <label htmlFor="f-voltage" className="block text-sm font-medium text-graphite-800">
          System voltage
        </label>
        <select id="f-voltage" className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2" {...form.register("systemVoltage", { valueAsNumber: true })}>
          <option value={12}>12 V</option>
          <option value={24}>24 V</option>
        </select>
      </div>
      <div className="flex items-end gap-3">
        <button type="submit" className="rounded-md bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" disabled={create.isPending} data-testid="job-create">
          Open the job
        </button>
        {onCancel ? (
          <button type="button" onClick={onCancel} className="rounded-md border border-graphite-300 px-4 py-2.5 font-medium hover:bg-graphite-100">
            Cancel
          </button>
        ) : null}
      </div>
      <div className="sm:col-span-2">
        <FormError message={create.error?.message} />
      </div>
    </form>
  );
}
