"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { IssueList } from "@/components/jobs/job-detail";
import { LIMIT_FIELDS, type Limits } from "@/lib/diagnosis/limits";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import { diagnosisLimitsInput, type DiagnosisLimitsInput } from "@/lib/validators/limits";

type Props = { orgId: string; canEdit: boolean; limits: Limits; own: Record<string, number>; updated: string | null };

/** The organisation's diagnosis limits: each figure with its common-practice default; owners and leads change them. */
export function LimitsForm({ orgId, canEdit, limits, own, updated }: Props) {
  const router = useRouter();
  const save = useMutation<unknown, ApiClientError, DiagnosisLimitsInput>({
    mutationFn: (json) => apiFetch(`/api/v1/organizations/${orgId}/limits`, { method: "PUT", json }),
    onSuccess: () => router.refresh(),
  });
  const form = useForm<DiagnosisLimitsInput>({ resolver: zodResolver(diagnosisLimitsInput), defaultValues: { limits: own } });
  const errors = form.formState.errors.limits as Record<string, { message?: string }> | undefined;
  return (
    <form
      className="mt-3 rounded-lg border border-graphite-100 bg-paper-raised p-5"
      noValidate
      onSubmit={form.handleSubmit((v) => save.mutate({ limits: Object.fromEntries(Object.entries(v.limits).filter(([, x]) => x !== undefined && !Number.isNaN(x))) }))}
      data-testid="limits-form"
    >
      <p className="text-sm text-graphite-700">
        Test plans judge readings by these figures. Each starts at common practice; set your own where the vehicle makers&rsquo; figures or your own experience say otherwise. An empty box means the default.
      </p>
      <table className="mt-3 w-full text-sm">
        <thead>
          <tr className="text-left">
            <th className="py-1 pr-2 font-semibold">Figure</th>
            <th className="py-1 pr-2 font-semibold">Common practice</th>
            <th className="py-1 font-semibold">{canEdit ? "Yours" : "In force"}</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {LIMIT_FIELDS.map((f) => (
            <tr key={f.key}>
              <td className="py-2 pr-2">
                <label htmlFor={`limit-${f.key}`}>{f.label}</label>
                {errors?.[f.key]?.message ? (
                  <span className="block text-over" role="alert">
                    {errors[f.key]!.message}
                  </span>
                ) : null}
              </td>
              <td className="py-2 pr-2 tabular-nums text-graphite-700">
                {f.default} {f.unit}
              </td>
              <td className="py-2">
                {canEdit ? (
                  <input
                    id={`limit-${f.key}`}
                    type="text"
                    inputMode="decimal"
                    autoComplete="off"
                    placeholder={String(f.default)}
                    className="w-28 rounded-md border border-graphite-300 bg-white px-2 py-1"
                    {...form.register(`limits.${f.key}`, { setValueAs: (v: unknown) => (v === "" ? undefined : v) })}
                    data-testid={`limit-${f.key}`}
                  />
                ) : (
                  <span className={`tabular-nums ${own[f.key] !== undefined ? "font-semibold" : ""}`}>
                    {limits[f.key]} {f.unit}
                  </span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {updated ? <p className="mt-2 text-xs text-graphite-500">{updated}</p> : null}
      {canEdit ? (
        <div className="mt-4 flex flex-wrap gap-2">
          <button type="submit" disabled={save.isPending} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="limits-save">
            Save the limits
          </button>
          <button
            type="button"
            className="rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100"
            onClick={() => {
              form.reset({ limits: {} });
              save.mutate({ limits: {} });
            }}
          >
            Back to common practice
          </button>
          {save.isSuccess ? (
            <span className="self-center text-sm text-within" role="status">
              Saved.
            </span>
          ) : null}
        </div>
      ) : null}
      <IssueList error={save.error} />
    </form>
  );
}
