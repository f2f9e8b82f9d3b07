"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { IssueList } from "@/components/jobs/job-detail";
import { useCreateCircuit } from "@/lib/hooks/circuits";
import { TEMPLATES } from "@/lib/workspace/templates";

/** Starts a circuit in one of the caller's jobs, empty or from a starting point, and opens it in the workspace. */
export function StartCircuit({ jobs }: { jobs: { id: string; title: string; systemVoltage: number }[] }) {
  const router = useRouter();
  const [jobId, setJobId] = useState(jobs[0]?.id ?? "");
  const [template, setTemplate] = useState("charging");
  const create = useCreateCircuit(jobId);
  const job = jobs.find((j) => j.id === jobId);
  if (!jobs.length) return <p className="text-graphite-700">Open a job first: a circuit always belongs to a job (a vehicle and its complaint, or a worked example).</p>;
  return (
    <form
      className="space-y-4"
      onSubmit={(e) => {
        e.preventDefault();
        const t = TEMPLATES.find((x) => x.id === template)!;
        create.mutate({ document: t.build(job?.systemVoltage ?? 12) }, { onSuccess: (res) => router.push(`/circuits/${res.circuit.id}/workspace`) });
      }}
      data-testid="start-circuit"
    >
      <label className="block text-sm font-medium">
        In the job
        <select value={jobId} onChange={(e) => setJobId(e.target.value)} className="mt-1 block w-full rounded-md border border-graphite-300 bg-white px-3 py-2" data-testid="start-job">
          {jobs.map((j) => (
            <option key={j.id} value={j.id}>
              {j.title} ({j.systemVoltage} V)
            </option>
          ))}
        </select>
      </label>
      <fieldset>
        <legend className="text-sm font-medium">Start from</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          {TEMPLATES.map((t) => (
            <label key={t.id} className={`flex cursor-pointer gap-3 rounded-md border p-3 ${template === t.id ? "border-copper-500 bg-copper-50" : "border-graphite-100 bg-white"}`}>
              <input type="radio" name="template" value={t.id} checked={template === t.id} onChange={() => setTemplate(t.id)} data-testid={`template-${t.id}`} />
              <span>
                <span className="block font-semibold">{t.name}</span>
                <span className="block text-sm text-graphite-700">{t.summary}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <p className="text-xs text-graphite-500">Starting points carry typical values to replace with the vehicle&rsquo;s own: the battery label, the service information, lengths you measure.</p>
      <button type="submit" disabled={create.isPending} className="rounded-md bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="start-create">
        Create and open
      </button>
      <IssueList error={create.error} />
    </form>
  );
}
