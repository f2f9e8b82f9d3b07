"use client";

import { InsulationOptions } from "@/components/sizing/insulation-options";
import { useEffect, useMemo, useRef } from "react";
import { useForm, useWatch } from "react-hook-form";
import { SafetyNote } from "@/components/ui/safety-note";
import type { CircuitDocument } from "@/lib/circuit";
import type { Duty } from "@/lib/conductors";
import { solveCircuit } from "@/lib/solver";
import { LOAD_DEFAULTS, parseEfficiency, parseLoad } from "@/lib/conductors/sizing-form";
import { parseQuantity } from "@/lib/units";
import { planAddedLoad, tapChoices, type AddLoadInput, type AddLoadPlan } from "@/lib/workspace/add-load";
import { supplyRow } from "@/lib/workspace/supply";

type Values = {
  label: string;
  tap: string;
  ground: string;
  demand: string;
  efficiency: string;
  duty: "continuous" | "intermittent";
  onTime: string;
  period: string;
  feedLength: string;
  groundLength: string;
  zone: AddLoadInput["zone"];
  insulation: string;
  family: AddLoadInput["family"];
  circuitClass: AddLoadInput["circuitClass"];
  fromState: string;
  stateName: string;
};

type Read = { ok: true; input: AddLoadInput } | { ok: false; errors: Partial<Record<keyof Values, string>> };

/** The typed values, with their units, as a request to the planner; or what to fix, field by field. */
function read(v: Values): Read {
  const errors: Partial<Record<keyof Values, string>> = {};
  const positive = (key: keyof Values, q: Parameters<typeof parseQuantity>[1], unit: string) => {
    const r = parseQuantity(v[key], q, unit);
    if (!r.ok) errors[key] = r.message;
    else if (!(r.value > 0)) errors[key] = "must be more than 0";
    return r.ok ? r.value : 0;
  };
  // The load's draw: a current ("150 A", or a plain number in A) or a power ("1500 W", "1.5 kW").
  // The same reading of the load as the sizing page's.
  let demand: AddLoadInput["demand"] = { mode: "current", value: 0 };
  let efficiency: number | undefined;
  const load = parseLoad(v.demand);
  if (!load.ok) errors.demand = load.message;
  else if (load.powerW !== undefined) {
    demand = { mode: "power", value: load.powerW };
    const e = parseEfficiency(v.efficiency);
    if (!e.ok) errors.efficiency = e.message;
    else efficiency = e.value;
  } else demand = { mode: "current", value: load.currentA ?? 0 };
  const feedLengthM = positive("feedLength", "length", "m");
  const groundLengthM = positive("groundLength", "length", "m");
  let duty: Duty = { kind: "continuous" };
  if (v.duty === "intermittent") {
    const onS = positive("onTime", "time", "s");
    const periodS = positive("period", "time", "s");
    if (onS > periodS) errors.onTime = "cannot be longer than the period";
    duty = { kind: "intermittent", onS, periodS };
  }
  if (!v.label.trim()) errors.label = "name it, e.g. Winch";
  if (!v.stateName.trim()) errors.stateName = "name the state, e.g. Winch pulling";
  if (Object.keys(errors).length) return { ok: false, errors };
  return {
    ok: true,
    input: { label: v.label.trim(), tap: v.tap, ground: v.ground, demand, efficiency, duty, feedLengthM, groundLengthM, zone: v.zone, insulation: v.insulation, family: v.family, circuitClass: v.circuitClass, fromState: v.fromState, stateName: v.stateName },
  };
}

const field = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-2 py-1.5";

/**
 * "Add a load": where it taps power and grounds, what it draws and how often, and its route. The conductor engine
 * proposes the cable and fuse; the preview shows them and the supply balance before anything is added.
 */
export function AddLoadDialog(props: { doc: CircuitDocument; currentState: string; onAdd: (plan: Extract<AddLoadPlan, { ok: true }>) => void; onClose: () => void }) {
  const choices = useMemo(() => tapChoices(props.doc), [props.doc]);
  const charging = props.doc.states?.find((s) => /charg|running|idle/i.test(`${s.id} ${s.name}`))?.id;
  const form = useForm<Values>({
    defaultValues: {
      label: "Winch",
      tap: choices.tap[0]?.ref ?? "",
      ground: choices.ground.find((g) => g.ref.endsWith(".t"))?.ref ?? choices.ground[0]?.ref ?? "",
      demand: "150 A",
      efficiency: LOAD_DEFAULTS.efficiency,
      duty: "intermittent",
      onTime: "1 min",
      period: "10 min",
      feedLength: "4 m",
      groundLength: "4 m",
      zone: LOAD_DEFAULTS.zone,
      insulation: LOAD_DEFAULTS.insulation,
      family: LOAD_DEFAULTS.family,
      circuitClass: LOAD_DEFAULTS.circuitClass,
      fromState: props.currentState !== "base" ? props.currentState : (charging ?? "base"),
      stateName: "Winch pulling",
    },
  });
  const values = useWatch({ control: form.control }) as Values;
  const parsed = read(values);
  // The efficiency field shows for a power, even while it (or another field) still needs fixing.
  const load = parseLoad(values.demand ?? "");
  const demandIsPower = load.ok && load.powerW !== undefined;
  const plan = parsed.ok ? planAddedLoad(props.doc, parsed.input) : null;
  const supply = plan?.ok ? supplyRow(plan.doc, plan.stateId, solveCircuit(plan.doc, { state: plan.stateId })) : null;
  const first = useRef<HTMLInputElement | null>(null);
  useEffect(() => first.current?.focus(), []);
  const err = (key: keyof Values) =>
    !parsed.ok && parsed.errors[key] ? (
      <span className="mt-0.5 block text-xs text-over" role="alert">
        {parsed.errors[key]}
      </span>
    ) : plan && !plan.ok && plan.field === key ? (
      <span className="mt-0.5 block text-xs text-over" role="alert">
        {plan.message}
      </span>
    ) : null;
  const labelReg = form.register("label");
  return (
    <div
      className="fixed inset-0 z-50 flex items-end justify-center bg-graphite-950/50 sm:items-center sm:p-6"
      onKeyDown={(e) => {
        if (e.key === "Escape") props.onClose();
      }}
    >
      <div role="dialog" aria-modal="true" aria-labelledby="add-load-title" className="max-h-[94dvh] w-full max-w-4xl overflow-auto rounded-t-xl bg-paper-raised p-5 shadow-xl sm:rounded-xl" data-testid="add-load-dialog">
        <h2 id="add-load-title" className="text-xl font-semibold">
          Add a load
        </h2>
        <p className="mt-1 text-sm text-graphite-700">Say where it takes power and where it grounds, what it draws and how its cables run. The cable and fuse are sized for you; check them before adding.</p>
        <form
          className="mt-4 grid gap-5 md:grid-cols-[minmax(0,1.2fr)_minmax(0,1fr)]"
          onSubmit={form.handleSubmit(() => {
            if (plan?.ok) props.onAdd(plan);
          })}
        >
          <fieldset className="grid content-start gap-3 sm:grid-cols-2">
            <label className="block text-sm">
              <span className="font-medium">Name</span>
              <input
                {...labelReg}
                ref={(el) => {
                  labelReg.ref(el);
                  first.current = el;
                }}
                className={field}
                data-testid="load-label"
              />
              {err("label")}
            </label>
            <label className="block text-sm">
              <span className="font-medium">Draws</span>
              <input {...form.register("demand")} className={`${field} font-mono`} data-testid="load-demand" />
              <span className="mt-0.5 block text-xs text-graphite-500">a current (150 A) or a power (1500 W)</span>
              {err("demand")}
            </label>
            {demandIsPower ? (
              <label className="block text-sm">
                <span className="font-medium">Efficiency</span>
                <input {...form.register("efficiency")} className={`${field} font-mono`} data-testid="load-efficiency" />
                <span className="mt-0.5 block text-xs text-graphite-500">an inverter about 90 %; lamps and heaters 100 %</span>
                {err("efficiency")}
              </label>
            ) : null}
            <label className="block text-sm">
              <span className="font-medium">Takes power from</span>
              <select {...form.register("tap")} className={field} data-testid="load-tap">
                {choices.tap.map((t) => (
                  <option key={t.ref} value={t.ref}>
                    {t.name}
                  </option>
                ))}
              </select>
              {err("tap")}
            </label>
            <label className="block text-sm">
              <span className="font-medium">Grounds to</span>
              <select {...form.register("ground")} className={field} data-testid="load-ground">
                {choices.ground.map((t) => (
                  <option key={t.ref} value={t.ref}>
                    {t.name}
                  </option>
                ))}
              </select>
              {err("ground")}
            </label>
            <label className="block text-sm">
              <span className="font-medium">Feed, fuse to load</span>
              <input {...form.register("feedLength")} className={`${field} font-mono`} data-testid="load-feed-length" />
              <span className="mt-0.5 block text-xs text-graphite-500">any unit: 4 m, 13 ft</span>
              {err("feedLength")}
            </label>
            <label className="block text-sm">
              <span className="font-medium">Ground cable</span>
              <input {...form.register("groundLength")} className={`${field} font-mono`} data-testid="load-ground-length" />
              {err("groundLength")}
            </label>
            <label className="block text-sm">
              <span className="font-medium">Duty</span>
              <select {...form.register("duty")} className={field} data-testid="load-duty">
                <option value="continuous">Continuous</option>
                <option value="intermittent">Intermittent (winch, liftgate)</option>
              </select>
            </label>
            {values.duty === "intermittent" ? (
              <div className="grid grid-cols-2 gap-2">
                <label className="block text-sm">
                  <span className="font-medium">On for</span>
                  <input {...form.register("onTime")} className={`${field} font-mono`} data-testid="load-on-time" />
                  {err("onTime")}
                </label>
                <label className="block text-sm">
                  <span className="font-medium">In every</span>
                  <input {...form.register("period")} className={`${field} font-mono`} data-testid="load-period" />
                  {err("period")}
                </label>
              </div>
            ) : (
              <span />
            )}
            <label className="block text-sm">
              <span className="font-medium">Routed through</span>
              <select {...form.register("zone")} className={field} data-testid="load-zone">
                <option value="cabin">Cabin</option>
                <option value="underbody">Underbody</option>
                <option value="engine">Engine compartment</option>
              </select>
            </label>
            <label className="block text-sm">
              <span className="font-medium">Cable type</span>
              <select {...form.register("insulation")} className={field} data-testid="load-insulation">
                <InsulationOptions />
              </select>
            </label>
            <label className="block text-sm">
              <span className="font-medium">Sizes</span>
              <select {...form.register("family")} className={field}>
                <option value="awg">AWG</option>
                <option value="metric">Metric (mm²)</option>
              </select>
            </label>
            <label className="block text-sm">
              <span className="font-medium">Drop allowed</span>
              <select {...form.register("circuitClass")} className={field}>
                <option value="critical">3 % (critical)</option>
                <option value="non-critical">10 % (non-critical)</option>
              </select>
            </label>
            <label className="block text-sm">
              <span className="font-medium">On together with</span>
              <select {...form.register("fromState")} className={field} data-testid="load-from-state">
                <option value="base">Base (as drawn)</option>
                {(props.doc.states ?? []).map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </select>
              {err("fromState")}
            </label>
            <label className="block text-sm">
              <span className="font-medium">Name of the new state</span>
              <input {...form.register("stateName")} className={field} data-testid="load-state-name" />
              {err("stateName")}
            </label>
          </fieldset>

          <div className="space-y-3" aria-live="polite" data-testid="load-proposal">
            {plan?.ok ? (
              <>
                <div className="rounded-lg bg-graphite-900 p-4 text-white">
                  <p className="text-xs uppercase tracking-wide text-graphite-300">Proposed</p>
                  <p className="mt-1 font-mono text-2xl" data-testid="load-size">
                    {plan.size}
                  </p>
                  <p className="text-lg" data-testid="load-fuse">
                    {plan.fuseA} A fuse at the tap
                  </p>
                  <p className="mt-1 text-sm text-graphite-300">{plan.sizing.reason}</p>
                </div>
                <p className="text-sm text-graphite-700">
                  Adds {plan.ids.fuse} (fuse), {plan.ids.load} ({parsed.ok ? parsed.input.label : ""}, off in every state but the new one) and cables {plan.ids.wires.join(", ")}, and the state &ldquo;
                  {parsed.ok ? parsed.input.stateName.trim() : ""}&rdquo;.
                </p>
                {supply ? (
                  <p
                    className={`rounded px-3 py-2 text-sm ${supply.verdict === "deficit" ? "bg-over-soft" : supply.verdict === "keeps-up" ? "bg-within-soft" : "bg-caution-soft"}`}
                    data-testid="load-supply"
                  >
                    {supply.verdict === "deficit" ? "▲ " : ""}
                    {supply.message}
                  </p>
                ) : null}
              </>
            ) : plan && !plan.ok && !plan.field ? (
              <p className="rounded bg-over-soft px-3 py-2 text-sm" role="alert">
                {plan.message}
              </p>
            ) : (
              <p className="rounded border border-graphite-100 px-3 py-2 text-sm text-graphite-700">Fix the marked fields to see the proposal.</p>
            )}
            <SafetyNote
              title="Before you fit it"
              items={[
                "Fit the fuse at the source end, and connect the battery end last.",
                "Grommet every pass through metal; keep high-current cables clear of moving parts and exhaust heat.",
                "Follow the vehicle maker's body-builder and service information and the local rules.",
              ]}
            />
            <div className="flex flex-wrap gap-2">
              <button type="submit" disabled={!plan?.ok} className="rounded-md bg-copper-600 px-4 py-2 font-medium text-white disabled:opacity-40" data-testid="load-add">
                Add to the circuit
              </button>
              <button type="button" onClick={props.onClose} className="rounded-md border border-graphite-300 px-4 py-2">
                Cancel
              </button>
            </div>
          </div>
        </form>
      </div>
    </div>
  );
}
