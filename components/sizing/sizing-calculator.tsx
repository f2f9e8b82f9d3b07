"use client";

import { useEffect, useMemo, useState } from "react";
import { INSULATION_TYPES, sizeCable, type SizingAnswer, type SizingRequest } from "@/lib/conductors";
import { parseQuantity } from "@/lib/units";
import { DropChart } from "./drop-chart";

type Inputs = {
  systemVoltage: string;
  current: string;
  length: string;
  circuitClass: "critical" | "non-critical";
  zone: "cabin" | "engine" | "underbody";
  insulation: string;
  bundle: string;
  family: "awg" | "metric";
  returnPath: "two-wire" | "chassis";
  returnResistance: string;
  duty: "continuous" | "intermittent";
  onTime: string;
  period: string;
};

const initial: Inputs = {
  systemVoltage: "12",
  current: "20 A",
  length: "6 m",
  circuitClass: "critical",
  zone: "cabin",
  insulation: "TXL",
  bundle: "1",
  family: "awg",
  returnPath: "two-wire",
  returnResistance: "5 mOhm",
  duty: "continuous",
  onTime: "1 min",
  period: "10 min",
};

type Parsed = { ok: true; request: SizingRequest } | { ok: false; errors: Partial<Record<keyof Inputs, string>> };

/** Reads the typed values with their units into a sizing request, or says what to fix field by field. */
function parse(i: Inputs): Parsed {
  const errors: Partial<Record<keyof Inputs, string>> = {};
  const q = (key: keyof Inputs, kind: Parameters<typeof parseQuantity>[1], unit?: string) => {
    const r = parseQuantity(i[key], kind, unit);
    if (!r.ok) errors[key] = r.message;
    else if (!(r.value > 0)) errors[key] = "must be more than 0";
    return r.ok ? r.value : 0;
  };
  const currentA = q("current", "current", "A");
  const lengthM = q("length", "length", "m");
  const returnR = i.returnPath === "chassis" ? q("returnResistance", "resistance", "ohm") : 0;
  const onS = i.duty === "intermittent" ? q("onTime", "time", "s") : 0;
  const periodS = i.duty === "intermittent" ? q("period", "time", "s") : 0;
  if (i.duty === "intermittent" && onS > periodS) errors.onTime = "the on time cannot be longer than the period";
  const bundle = Number(i.bundle);
  if (!Number.isInteger(bundle) || bundle < 1 || bundle > 200) errors.bundle = "a whole number of conductors, 1 or more";
  if (currentA > 5000) errors.current = "above 5000 A is outside the tables";
  if (lengthM > 1000) errors.length = "above 1000 m is not a vehicle cable run";
  if (Object.keys(errors).length) return { ok: false, errors };
  const rating = INSULATION_TYPES.find((t) => t.id === i.insulation)?.ratingC ?? 105;
  return {
    ok: true,
    request: {
      systemVoltage: Number(i.systemVoltage),
      currentA,
      lengthM,
      circuitClass: i.circuitClass,
      zone: i.zone,
      insulationRatingC: rating,
      bundleSize: bundle,
      family: i.family,
      returnPath: i.returnPath,
      returnResistanceOhm: i.returnPath === "chassis" ? returnR : undefined,
      duty: i.duty === "intermittent" ? { kind: "intermittent", onS, periodS } : { kind: "continuous" },
    },
  };
}

const input = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2";

/** The choices a URL may set; anything else in it is ignored. Text fields take any short text (parse judges it). */
const CHOICES: Partial<Record<keyof Inputs, readonly string[]>> = {
  systemVoltage: ["12", "24"],
  circuitClass: ["critical", "non-critical"],
  zone: ["cabin", "engine", "underbody"],
  insulation: INSULATION_TYPES.map((t) => t.id),
  family: ["awg", "metric"],
  returnPath: ["two-wire", "chassis"],
  duty: ["continuous", "intermittent"],
};

/** The inputs a shared or bookmarked address carries, over the defaults. */
export function inputsFromQuery(search: string): Inputs {
  const q = new URLSearchParams(search);
  const next = { ...initial };
  for (const key of Object.keys(initial) as (keyof Inputs)[]) {
    const value = q.get(key);
    if (value === null || value.length > 40) continue;
    const allowed = CHOICES[key];
    if (allowed && !allowed.includes(value)) continue;
    (next as Record<string, string>)[key] = value;
  }
  return next;
}

/** Only what differs from the defaults goes into the address, so a shared link stays short. */
export function queryFromInputs(v: Inputs): string {
  const q = new URLSearchParams();
  for (const key of Object.keys(initial) as (keyof Inputs)[]) if (v[key] !== initial[key]) q.set(key, v[key]);
  const s = q.toString();
  return s ? `?${s}` : "";
}

/** The upfitter's quick cable and fuse sizing: computed in the browser as the values are typed. */
export function SizingCalculator() {
  const [v, setV] = useState<Inputs>(initial);
  // The address carries the inputs: read once after hydration, then kept up to date as they change.
  const [loaded, setLoaded] = useState(false);
  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the page is prerendered; the address is only known here
    setV(inputsFromQuery(window.location.search));
    setLoaded(true);
  }, []);
  useEffect(() => {
    if (loaded) window.history.replaceState(null, "", `${window.location.pathname}${queryFromInputs(v)}`);
  }, [v, loaded]);
  const parsed = useMemo(() => parse(v), [v]);
  const answer: SizingAnswer | null = parsed.ok ? sizeCable(parsed.request) : null;
  const set = (key: keyof Inputs) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV((old) => ({ ...old, [key]: e.target.value }));
  const err = (key: keyof Inputs) =>
    !parsed.ok && parsed.errors[key] ? (
      <span className="mt-1 block text-sm text-over" role="alert" data-testid={`size-error-${key}`}>
        {parsed.errors[key]}
      </span>
    ) : null;
  const text = (key: keyof Inputs, label: string, hint: string) => (
    <label className="block text-sm">
      <span className="font-medium text-graphite-800">{label}</span>
      <input className={`${input} font-mono`} value={v[key]} onChange={set(key)} aria-invalid={!parsed.ok && parsed.errors[key] ? true : undefined} data-testid={`size-${key}`} />
      <span className="mt-1 block text-xs text-graphite-500">{hint}</span>
      {err(key)}
    </label>
  );
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.3fr)]">
      <form className="min-w-0 space-y-4 self-start rounded-lg border border-graphite-100 bg-paper-raised p-5" onSubmit={(e) => e.preventDefault()} data-testid="size-form">
        <div className="grid gap-4 sm:grid-cols-2">
          {text("current", "Load current (peak)", "any unit: 20 A, 1500 mA")}
          {text("length", "Run length, one way", "any unit: 6 m, 18 ft")}
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">System</span>
            <select className={input} value={v.systemVoltage} onChange={set("systemVoltage")} data-testid="size-systemVoltage">
              <option value="12">12 V</option>
              <option value="24">24 V</option>
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Circuit</span>
            <select className={input} value={v.circuitClass} onChange={set("circuitClass")} data-testid="size-circuitClass">
              <option value="critical">Critical: 3 % drop at most</option>
              <option value="non-critical">Non-critical: 10 % drop at most</option>
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Routed through</span>
            <select className={input} value={v.zone} onChange={set("zone")} data-testid="size-zone">
              <option value="cabin">Cabin (30 °C)</option>
              <option value="underbody">Underbody (40 °C)</option>
              <option value="engine">Engine compartment (50 °C)</option>
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Cable type</span>
            <select className={input} value={v.insulation} onChange={set("insulation")} data-testid="size-insulation">
              {INSULATION_TYPES.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name} ({t.ratingC} °C)
                </option>
              ))}
            </select>
          </label>
          {text("bundle", "Conductors in the bundle", "1 if it runs alone")}
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Sizes</span>
            <select className={input} value={v.family} onChange={set("family")} data-testid="size-family">
              <option value="awg">AWG</option>
              <option value="metric">Metric (mm²)</option>
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Return</span>
            <select className={input} value={v.returnPath} onChange={set("returnPath")} data-testid="size-returnPath">
              <option value="two-wire">Its own ground cable</option>
              <option value="chassis">Through the chassis</option>
            </select>
          </label>
          {v.returnPath === "chassis" ? text("returnResistance", "Chassis return resistance", "the frame and its joints: 5 mOhm") : null}
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Duty</span>
            <select className={input} value={v.duty} onChange={set("duty")} data-testid="size-duty">
              <option value="continuous">Continuous</option>
              <option value="intermittent">Intermittent (winch, liftgate)</option>
            </select>
          </label>
          {v.duty === "intermittent" ? (
            <>
              {text("onTime", "On for", "1 min, 45 s")}
              {text("period", "In every", "10 min")}
            </>
          ) : null}
        </div>
      </form>

      <div className="min-w-0 space-y-4" aria-live="polite" data-testid="size-result">
        {!answer ? (
          <p className="rounded-lg border border-graphite-100 bg-paper-raised p-5 text-graphite-700">Fix the marked fields to see the size.</p>
        ) : (
          <>
            <div className={`rounded-lg p-5 ${answer.recommended ? "bg-graphite-900 text-white" : "border border-over/30 bg-over-soft"}`}>
              {answer.recommended ? (
                <>
                  <p className="text-sm uppercase tracking-wide text-graphite-300">Smallest cable that meets every limit</p>
                  <p className="mt-1 font-mono text-4xl" data-testid="size-recommended">
                    {answer.recommended.size}
                  </p>
                  {answer.protection ? (
                    <p className="mt-2 text-lg" data-testid="size-protection">
                      {answer.protection.ratingA} A {answer.protection.type === "blade" ? "blade fuse" : answer.protection.type === "bolt-in" ? "bolt-in fuse" : "breaker"}
                    </p>
                  ) : null}
                  <p className="mt-2 text-sm text-graphite-300" data-testid="size-reason">
                    {answer.reason}
                  </p>
                </>
              ) : (
                <p className="text-over" data-testid="size-reason">
                  {answer.reason}
                </p>
              )}
            </div>
            <div className="overflow-x-auto rounded-lg border border-graphite-100 bg-paper-raised">
              <table className="w-full min-w-[36rem] text-sm">
                <thead className="text-left text-graphite-500">
                  <tr>
                    <th className="px-3 py-2 font-medium">Size</th>
                    <th className="px-3 py-2 text-right font-medium">Drop</th>
                    <th className="px-3 py-2 text-right font-medium">Heat</th>
                    <th className="px-3 py-2 text-right font-medium">May carry</th>
                    <th className="px-3 py-2 font-medium">Fails on</th>
                  </tr>
                </thead>
                <tbody>
                  {answer.candidates.map((c) => (
                    <tr key={c.size} className={`border-t border-graphite-100 ${c.size === answer.recommended?.size ? "bg-copper-50 font-semibold" : ""}`}>
                      <td className="px-3 py-1.5 font-mono">{c.size}</td>
                      <td className="px-3 py-1.5 text-right font-mono">
                        {c.dropV.toFixed(3)} V ({c.dropPercent.toFixed(1)} %)
                      </td>
                      <td className="px-3 py-1.5 text-right font-mono">{c.lossW.toFixed(1)} W</td>
                      <td className="px-3 py-1.5 text-right font-mono">
                        {c.ampacityA.toFixed(0)} A{c.derived ? "*" : ""}
                      </td>
                      <td className="px-3 py-1.5 text-graphite-700">{c.ok ? (c.size === answer.recommended?.size ? "chosen" : "") : (c.governing ?? "")}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <p className="px-3 py-2 text-xs text-graphite-500">
                * not a row of 33 CFR 183.425 Table 5; interpolated in circular mils. &ldquo;May carry&rdquo; is the table value after the ambient and bundle
                factors.
              </p>
            </div>
            <DropChart answer={answer} />
            <ul className="list-disc space-y-1 pl-5 text-sm text-graphite-700">
              {answer.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          </>
        )}
      </div>
    </div>
  );
}
