"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { CRANKING_LIMITS_V, quickCheckCircuit, quickCheckDefaults, quickCheckInput, type QuickCheckInput } from "@/lib/circuit/quick-check";
import { AWG_SIZES, METRIC_SIZES } from "@/lib/conductors/sizes";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import type { SolveResult } from "@/lib/solver/types";

type FormIn = z.input<typeof quickCheckInput>;

const fields: { name: keyof QuickCheckInput; label: string; unit: string; step?: string }[] = [
  { name: "restingVolts", label: "Battery at rest", unit: "V", step: "0.01" },
  { name: "internalMilliohm", label: "Battery internal resistance", unit: "mΩ", step: "0.1" },
  { name: "starterAmps", label: "Starter draw while cranking", unit: "A", step: "1" },
  { name: "positiveLengthM", label: "Positive cable length", unit: "m", step: "0.1" },
  { name: "positiveJointMilliohm", label: "Positive clamp joint", unit: "mΩ", step: "0.1" },
  { name: "groundLengthM", label: "Ground cable length", unit: "m", step: "0.1" },
  { name: "groundJointMilliohm", label: "Ground bolt joint", unit: "mΩ", step: "0.1" },
];

const fmt = (v: number, digits = 2) => v.toFixed(digits);

/** The free cranking check on the start page: computed by POST /api/v1/solve. */
export function QuickCheck() {
  const form = useForm<FormIn, unknown, QuickCheckInput>({ resolver: zodResolver(quickCheckInput), defaultValues: quickCheckDefaults, mode: "onBlur" });
  const solve = useMutation<SolveResult, ApiClientError, QuickCheckInput>({
    mutationFn: (input) => apiFetch<SolveResult>("/api/v1/solve", { method: "POST", json: { circuit: quickCheckCircuit(input) } }),
  });
  const r = solve.data;
  const positive = r ? r.terminals["B1.pos"] - r.terminals["M1.in"] : 0;
  const ground = r ? r.terminals["M1.case"] - r.terminals["B1.neg"] : 0;
  const rows = r
    ? [
        { label: "Positive path (battery post to starter)", value: positive, limit: CRANKING_LIMITS_V.positive, id: "positive" },
        { label: "Ground path (starter case to battery post)", value: ground, limit: CRANKING_LIMITS_V.ground, id: "ground" },
        { label: "Positive clamp joint", value: r.components.JP.voltage, limit: CRANKING_LIMITS_V.joint, id: "joint-positive" },
        { label: "Ground bolt joint", value: r.components.JG.voltage, limit: CRANKING_LIMITS_V.joint, id: "joint-ground" },
      ]
    : [];

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_1fr]">
      <form
        onSubmit={form.handleSubmit((values) => solve.mutate(values))}
        className="rounded-lg border border-graphite-100 bg-paper-raised p-5"
        noValidate
        data-testid="quick-check-form"
      >
        <div className="grid gap-4 sm:grid-cols-2">
          {fields.map((f) => {
            const err = form.formState.errors[f.name]?.message;
            return (
              <label key={f.name} className="block text-sm">
                <span className="font-medium text-graphite-800">{f.label}</span>
                <span className="mt-1 flex items-stretch overflow-hidden rounded-md border border-graphite-300 bg-white focus-within:border-copper-500">
                  <input
                    type="text"
                    inputMode="decimal"
                    autoComplete="off"
                    aria-invalid={err ? true : undefined}
                    className="w-full min-w-0 px-3 py-2 font-mono outline-none"
                    data-testid={`qc-${f.name}`}
                    {...form.register(f.name)}
                  />
                  <span className="flex items-center bg-graphite-100 px-3 text-graphite-700">{f.unit}</span>
                </span>
                {err ? <span className="mt-1 block text-over" role="alert">{err}</span> : null}
              </label>
            );
          })}
          {(["positiveSize", "groundSize"] as const).map((name) => (
            <label key={name} className="block text-sm">
              <span className="font-medium text-graphite-800">{name === "positiveSize" ? "Positive cable size" : "Ground cable size"}</span>
              <select className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2" data-testid={`qc-${name}`} {...form.register(name)}>
                <optgroup label="AWG">
                  {AWG_SIZES.map((s) => (
                    <option key={s.label}>{s.label}</option>
                  ))}
                </optgroup>
                <optgroup label="Metric">
                  {METRIC_SIZES.map((s) => (
                    <option key={s.label}>{s.label}</option>
                  ))}
                </optgroup>
              </select>
            </label>
          ))}
        </div>
        <button type="submit" className="mt-5 rounded-md bg-copper-600 px-5 py-2.5 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" disabled={solve.isPending} data-testid="qc-submit">
          {solve.isPending ? "Computing…" : "Compute the drops"}
        </button>
        {solve.error ? (
          <p className="mt-3 text-sm text-over" role="alert">
            {solve.error.message} {solve.error.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}
          </p>
        ) : null}
      </form>

      <div className="rounded-lg border border-graphite-100 bg-paper-raised p-5" aria-live="polite" data-testid="quick-check-result">
        {!r ? (
          <p className="text-graphite-700">
            Enter what you have and press <strong>Compute the drops</strong>. Ampwright solves the circuit and shows what a voltmeter across each part
            should read while cranking, so you know what a healthy reading looks like before you probe.
          </p>
        ) : r.status !== "ok" ? (
          <div role="alert">
            <p className="font-semibold text-over">The circuit could not be solved.</p>
            <ul className="mt-2 list-disc pl-5 text-sm">
              {r.issues.map((i) => (
                <li key={i.code + i.message}>{i.message}</li>
              ))}
            </ul>
          </div>
        ) : (
          <>
            <dl className="grid grid-cols-2 gap-3">
              <div className="rounded-md bg-graphite-900 p-3 text-white">
                <dt className="text-xs uppercase tracking-wide text-graphite-300">Battery posts while cranking</dt>
                <dd className="font-mono text-2xl" data-testid="qc-battery-volts">{fmt(r.components.B1.voltage)} V</dd>
              </div>
              <div className="rounded-md bg-graphite-900 p-3 text-white">
                <dt className="text-xs uppercase tracking-wide text-graphite-300">At the starter</dt>
                <dd className="font-mono text-2xl" data-testid="qc-starter-volts">{fmt(r.components.M1.voltage)} V</dd>
              </div>
            </dl>
            <table className="mt-4 w-full text-sm">
              <thead>
                <tr className="text-left text-graphite-500">
                  <th className="py-1 font-medium">Voltmeter across</th>
                  <th className="py-1 text-right font-medium">Expected</th>
                  <th className="py-1 text-right font-medium">Usual limit</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((row) => {
                  const over = Math.abs(row.value) > row.limit;
                  return (
                    <tr key={row.id} className="border-t border-graphite-100">
                      <td className="py-2">{row.label}</td>
                      <td className={`py-2 text-right font-mono ${over ? "font-semibold text-over" : "text-within"}`} data-testid={`qc-drop-${row.id}`}>
                        {fmt(row.value, 3)} V
                      </td>
                      <td className="py-2 text-right font-mono text-graphite-500">{fmt(row.limit, 1)} V</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            <p className="mt-3 text-xs text-graphite-500">
              Limits are common practice across makers&rsquo; service manuals, not one standard: about 0.5 V on the positive side, 0.2 V on the ground
              side and 0.1 V per connection while cranking. Your vehicle maker&rsquo;s figures come first. Measure with the engine cranking, probing the
              battery post itself, not the clamp.
            </p>
          </>
        )}
      </div>
    </div>
  );
}
