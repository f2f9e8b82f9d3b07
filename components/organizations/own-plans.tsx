"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { IssueList } from "@/components/jobs/job-detail";
import { BUILT_IN_PLANS, planSchema, type Plan } from "@/lib/diagnosis/plans";
import { ApiClientError, apiFetch } from "@/lib/query/client";

const secondary = "rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100 disabled:opacity-50";

/** A starting point: the built-in charging plan under a new id and name, for a shop to change. */
const STARTER = JSON.stringify({ ...BUILT_IN_PLANS[0], id: "my-charging", name: "Charging system (our version)" }, null, 2);

/**
 * The organisation's own test plans: listed for everyone, added and removed by owners and leads. A plan is data
 * (steps with lead positions, states and rules), typed as JSON and checked against the same schema as the built-in
 * plans, with every problem named by its place in the plan.
 */
export function OwnPlans({ orgId, canEdit, plans }: { orgId: string; canEdit: boolean; plans: { id: string; plan: Plan }[] }) {
  const router = useRouter();
  const add = useMutation<unknown, ApiClientError, Plan>({
    mutationFn: (plan) => apiFetch(`/api/v1/organizations/${orgId}/plans`, { method: "POST", json: { plan } }),
    onSuccess: () => router.refresh(),
  });
  const remove = useMutation<unknown, ApiClientError, string>({
    mutationFn: (id) => apiFetch(`/api/v1/organizations/${orgId}/plans/${id}`, { method: "DELETE" }),
    onSuccess: () => router.refresh(),
  });
  const form = useForm<{ text: string }>({ defaultValues: { text: STARTER } });
  const submit = form.handleSubmit(({ text }) => {
    add.reset();
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (e) {
      form.setError("text", { message: `This is not valid JSON: ${(e as Error).message}` });
      return;
    }
    const parsed = planSchema.safeParse(json);
    if (!parsed.success) {
      form.setError("text", { message: parsed.error.issues.slice(0, 6).map((i) => `${i.path.join(".") || "(plan)"}: ${i.message}`).join("; ") });
      return;
    }
    add.mutate(parsed.data);
  });
  return (
    <div className="mt-3 space-y-3">
      <p className="text-sm text-graphite-700">
        Besides the built-in charging and starting plans, {canEdit ? "you can add" : "owners and leads add"} plans of your own: the same steps, lead positions and rules, in your words and
        figures. Every technician then finds them on the test plan page.
      </p>
      {plans.length ? (
        <ul className="divide-y divide-graphite-100 rounded-lg border border-graphite-100 bg-paper-raised" data-testid="own-plans">
          {plans.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center justify-between gap-2 px-5 py-3">
              <span>
                <span className="font-medium">{p.plan.name}</span> <span className="text-sm text-graphite-500">({p.plan.steps.length} steps)</span>
              </span>
              {canEdit ? (
                <button type="button" className={`${secondary} text-over`} disabled={remove.isPending} onClick={() => remove.mutate(p.id)} aria-label={`Remove ${p.plan.name}`}>
                  Remove
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="rounded-lg border border-graphite-100 bg-paper-raised px-5 py-3 text-sm text-graphite-700">No plans of your own yet.</p>
      )}
      {canEdit ? (
        <details className="rounded-lg border border-graphite-100 bg-paper-raised p-4">
          <summary className="cursor-pointer font-medium">Add a plan</summary>
          <form className="mt-3 space-y-2" onSubmit={submit} noValidate data-testid="plan-form">
            <label htmlFor="plan-json" className="block text-sm">
              The plan, as JSON (this starts from a copy of the charging plan)
            </label>
            <textarea id="plan-json" rows={14} spellCheck={false} className="w-full rounded-md border border-graphite-300 bg-white px-3 py-2 font-mono text-xs" {...form.register("text")} data-testid="plan-json" />
            {form.formState.errors.text ? (
              <p className="text-sm text-over" role="alert">
                {form.formState.errors.text.message}
              </p>
            ) : null}
            <button type="submit" disabled={add.isPending} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="plan-add">
              Add the plan
            </button>
            <IssueList error={add.error ?? remove.error} />
          </form>
        </details>
      ) : null}
    </div>
  );
}
