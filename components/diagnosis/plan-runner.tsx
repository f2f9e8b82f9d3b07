"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { typedNumber } from "@/lib/units/number";
import { stateName, terminalLabel } from "@/components/circuits/describe";
import { IssueList } from "@/components/jobs/job-detail";
import { SafetyNote } from "@/components/ui/safety-note";
import { Unavailable } from "@/components/ui/unavailable";
import type { CircuitDocument } from "@/lib/circuit";
import { BUILT_IN_PLANS, runPlan, type Plan, type PlanVerdict, type StepResult } from "@/lib/diagnosis/plans";
import type { Limits } from "@/lib/diagnosis/limits";
import { formatVolts } from "@/lib/format";
import { useCircuit, useCreateReading, useReadings } from "@/lib/hooks/circuits";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";

const VERDICT_WORDS: Record<PlanVerdict["kind"], string> = {
  battery: "The battery",
  feed: "A feed",
  cable: "A cable on the positive side",
  joint: "A connection on the positive side",
  ground: "The ground side",
  unit: "The unit itself",
  none: "No fault found",
  incomplete: "Not finished",
};

const STATUS: Record<StepResult["status"], { label: string; className: string }> = {
  good: { label: "Good", className: "bg-within-soft text-within" },
  bad: { label: "Bad", className: "bg-over-soft text-over" },
  "not-read": { label: "To read", className: "bg-graphite-100 text-graphite-700" },
  cannot: { label: "Cannot", className: "bg-caution-soft text-caution" },
  "cannot-tell": { label: "Cannot tell yet", className: "bg-caution-soft text-caution" },
};

/** A guided test plan on one circuit: each check in order, recorded as readings, and the verdict they lead to. */
export function PlanRunner(props: { circuitId: string; planId?: string; limits?: Limits; limitsNote?: string; ownPlans?: Plan[] }) {
  const { circuitId, planId, limits, limitsNote } = props;
  const plans = useMemo(() => [...BUILT_IN_PLANS, ...(props.ownPlans ?? [])], [props.ownPlans]);
  const { data, error, isPending } = useCircuit(circuitId);
  const readings = useReadings(circuitId);
  const doc = data?.circuit.document;
  const [chosen, setChosen] = useState<string | undefined>(planId);
  const wanted = chosen ?? (doc?.components.some((c) => c.kind === "alternator") ? "charging" : "starting");
  const plan = plans.find((p) => p.id === wanted) ?? BUILT_IN_PLANS[0]!;
  const run = useMemo(() => (doc ? runPlan(plan, doc, readings.data ?? [], limits) : undefined), [plan, doc, readings.data, limits]);
  if (isPending) return <p className="text-graphite-500">Loading the circuit...</p>;
  if (error) return <Unavailable title="This circuit cannot be shown" message={error.message} testId="plan-missing" />;
  const { circuit, canEdit } = data;
  return (
    <div className="mx-auto max-w-3xl">
      <p className="text-sm">
        <Link href={`/jobs/${circuit.jobId}`} className="font-medium text-copper-700 underline-offset-2 hover:underline">
          {circuit.jobTitle}
        </Link>{" "}
        /{" "}
        <Link href={`/circuits/${circuit.id}`} className="font-medium text-copper-700 underline-offset-2 hover:underline">
          {circuit.name}
        </Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight" data-testid="plan-heading">
        {plan.name} test plan
      </h1>
      <p className="mt-1 text-graphite-700">For: {plan.complaint.toLowerCase()}. Work down the checks in order; each reading is kept with the circuit.</p>
      <div className="mt-3 flex flex-wrap gap-2" role="group" aria-label="Test plan">
        {plans.map((p) => (
          <button
            key={p.id}
            type="button"
            aria-pressed={p.id === plan.id}
            onClick={() => setChosen(p.id)}
            className={`rounded-md border px-3 py-1.5 text-sm font-medium ${p.id === plan.id ? "border-copper-600 bg-copper-50 text-copper-700" : "border-graphite-300 hover:bg-graphite-100"}`}
            data-testid={`plan-pick-${p.id}`}
          >
            {p.name}
          </button>
        ))}
      </div>
      <div className="mt-4">
        <SafetyNote
          items={[
            "The vehicle maker's service information and local rules come first where they differ from these checks; disable fuel or ignition before cranking as it says.",
            "Keep leads, hands and clothing clear of the fan, belts and exhaust while the engine runs.",
          ]}
        />
      </div>

      <ol className="mt-6 space-y-4" data-testid="plan-steps">
        {run?.steps.map((s, i) => (
          <li key={s.step.id} className={`${box} p-4`} data-testid="plan-step" data-status={s.status}>
            <div className="flex items-start justify-between gap-3">
              <h2 className="font-semibold">
                {i + 1}. {s.step.title}
              </h2>
              <span className={`shrink-0 rounded px-2 py-0.5 text-xs font-semibold ${STATUS[s.status].className}`} data-testid="plan-step-status">
                {STATUS[s.status].label}
              </span>
            </div>
            <p className="mt-1 text-sm">{s.step.setup}</p>
            {s.positive && s.negative && s.stateId ? (
              <p className="mt-2 text-sm">
                <span className="font-semibold text-over">Red</span> on {terminalLabel(circuit.document, s.positive)}, <span className="font-semibold">black</span> on{" "}
                {terminalLabel(circuit.document, s.negative)}; model state: {stateName(circuit.document, s.stateId)}.
              </p>
            ) : null}
            <p className="mt-1 text-sm text-graphite-700">Good: {s.step.good}</p>
            {s.missing ? <p className="mt-2 text-sm font-medium text-caution">Cannot check: {s.missing}.</p> : null}
            {s.measuredV !== undefined ? (
              <p className={`mt-2 text-sm font-medium ${s.status === "bad" ? "text-over" : ""}`} data-testid="plan-step-judged">
                Read {formatVolts(s.measuredV)}: {s.judged}.
              </p>
            ) : s.judged ? (
              <p className="mt-2 text-sm">{s.judged}.</p>
            ) : null}
            {canEdit && s.positive && s.negative && s.stateId ? (
              <RecordReading circuitId={circuit.id} positive={s.positive} negative={s.negative} stateId={s.stateId} note={`Test plan: ${s.step.title}`} again={s.measuredV !== undefined} />
            ) : null}
          </li>
        ))}
      </ol>

      {run ? <Verdict verdict={run.verdict} doc={circuit.document} circuitId={circuit.id} canEdit={canEdit} /> : null}
      <p className="mt-6 text-xs text-graphite-500" data-testid="plan-limits-note">
        {limitsNote ? `${limitsNote} ` : ""}Limits are common practice unless a source is named beside them; the vehicle maker&rsquo;s service information comes first where it gives its own figures.
      </p>
    </div>
  );
}

/** The verdict, the reasoning from the readings, and where to measure next when the readings cannot yet name a part. */
function Verdict({ verdict, doc, circuitId, canEdit }: { verdict: PlanVerdict; doc: CircuitDocument; circuitId: string; canEdit: boolean }) {
  const tone = verdict.kind === "none" ? "border-within/40 bg-within-soft" : verdict.kind === "incomplete" ? "border-graphite-300 bg-paper-raised" : "border-over/40 bg-over-soft";
  return (
    <section className={`mt-6 rounded-lg border p-5 ${tone}`} aria-labelledby="verdict-h" data-testid="plan-verdict" data-verdict={verdict.kind}>
      <p className="text-xs font-semibold uppercase tracking-wider text-graphite-700">Verdict</p>
      <h2 id="verdict-h" className="mt-1 text-xl font-semibold" data-testid="plan-verdict-title">
        {VERDICT_WORDS[verdict.kind]}
        {verdict.kind !== "none" && verdict.kind !== "incomplete" ? `: ${verdict.title}` : verdict.kind === "incomplete" ? `: ${verdict.title}` : ""}
      </h2>
      {verdict.reasons.length ? (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm" data-testid="plan-reasons">
          {verdict.reasons.map((r, i) => (
            <li key={i}>{r}</li>
          ))}
        </ul>
      ) : null}
      {verdict.suspect ? (
        <Link
          href={`/circuits/${circuitId}/workspace?focus=${encodeURIComponent(verdict.suspect.id)}${verdict.stateId ? `&state=${encodeURIComponent(verdict.stateId)}` : ""}&readings=1`}
          className="mt-3 inline-block rounded-md bg-copper-600 px-3 py-1.5 text-sm font-semibold text-white hover:bg-copper-700"
          data-testid="plan-show-suspect"
        >
          Show {verdict.suspect.id} on the canvas
        </Link>
      ) : null}
      {verdict.walk?.length && verdict.stateId ? (
        <div className="mt-4" data-testid="plan-walk">
          <h3 className="font-semibold">Measure across each part of that side, in the same state</h3>
          <ul className="mt-2 space-y-3">
            {verdict.walk.map((w) => {
              const part = doc.components.find((c) => c.id === w.id);
              const wire = doc.wires.find((x) => x.id === w.id);
              return (
                <li key={w.id} className={`${box} p-3`} data-testid="plan-walk-part">
                  <p className="text-sm font-medium">
                    {w.id}: {part ? (part.label ?? part.kind) : (wire?.label ?? "cable")}
                  </p>
                  <p className="text-sm text-graphite-700">
                    Red on {terminalLabel(doc, w.positive)}, black on {terminalLabel(doc, w.negative)}.
                  </p>
                  {canEdit ? <RecordReading circuitId={circuitId} positive={w.positive} negative={w.negative} stateId={verdict.stateId!} note={`Test plan: across ${w.id}`} again={false} /> : null}
                </li>
              );
            })}
          </ul>
        </div>
      ) : null}
      <p className="mt-4 text-sm">
        Write the verdict and the repair on the job so they go in the report, and retest after the repair with the same checks.
      </p>
    </section>
  );
}

const readingValue = z.object({
  value: typedNumber(z.number({ error: "type the meter's reading in volts, e.g. 0.42 (or 0,42)" }).finite().min(-1000, "at most 1000 V either way").max(1000, "at most 1000 V either way")),
  currentA: typedNumber(z.number({ error: "the clamp reading is a number of amperes" }).finite().min(0, "a clamp reading is positive").max(5000, "at most 5000 A").optional()),
});

/** The meter's reading for one check (and the clamp meter's current, if taken), recorded on the circuit. */
function RecordReading(p: { circuitId: string; positive: string; negative: string; stateId: string; note: string; again: boolean }) {
  const create = useCreateReading(p.circuitId);
  const form = useForm<z.input<typeof readingValue>, unknown, z.output<typeof readingValue>>({ resolver: zodResolver(readingValue) });
  const errors = form.formState.errors;
  const input = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2 text-base";
  return (
    <form
      className="mt-3 grid grid-cols-[1fr_1fr_auto] items-end gap-2"
      noValidate
      onSubmit={form.handleSubmit((v) =>
        create.mutate(
          { stateId: p.stateId, positive: p.positive, negative: p.negative, value: v.value, unit: "V", ...(v.currentA !== undefined ? { currentA: v.currentA } : {}), note: p.note },
          { onSuccess: () => form.reset() },
        ),
      )}
      data-testid="plan-record"
    >
      <label className="text-sm font-medium">
        Meter, V
        <input type="text" inputMode="decimal" autoComplete="off" className={input} {...form.register("value")} aria-invalid={errors.value ? true : undefined} data-testid="plan-value" />
      </label>
      <label className="text-sm font-medium">
        Clamp, A <span className="font-normal text-graphite-500">(optional)</span>
        <input type="text" inputMode="decimal" autoComplete="off" className={input} {...form.register("currentA")} data-testid="plan-current" />
      </label>
      <button type="submit" disabled={create.isPending} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="plan-save">
        {p.again ? "Record again" : "Record"}
      </button>
      {errors.value || errors.currentA ? (
        <p className="col-span-3 text-sm text-over" role="alert">
          {errors.value?.message ?? errors.currentA?.message}
        </p>
      ) : null}
      {create.error ? (
        <div className="col-span-3">
          <IssueList error={create.error} />
        </div>
      ) : null}
    </form>
  );
}
