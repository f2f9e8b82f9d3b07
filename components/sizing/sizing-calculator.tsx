"use client";

import { InsulationOptions } from "./insulation-options";
import { useDeferredValue, useEffect, useMemo, useState } from "react";
import { MATERIAL_IDS, MATERIALS, sizeCable, type Governing, type SizingAnswer } from "@/lib/conductors";
import { DeviceCurveChart } from "./device-curve-chart";
import { inputsFromQuery, parseSizingInputs as parse, queryFromInputs, SIZING_DEFAULTS as initial, type SizingInputs as Inputs } from "@/lib/conductors/sizing-form";
import { DropChart } from "./drop-chart";
import { SaveSizing } from "./save-sizing";

const input = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2";

const FAILS_ON: Record<Governing, string> = { drop: "voltage drop", ampacity: "heat", protection: "no device fits", "minimum-size": "below the minimum size" };

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
  const answer: SizingAnswer | null = useMemo(() => (parsed.ok ? sizeCable(parsed.request) : null), [parsed]);
  // The plot follows a moment later than the answer, so typing shows the size in the next frame.
  const plotted = useDeferredValue(answer);
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
          {text("current", "Load (peak current or power)", "20 A, 1500 mA, or 1500 W")}
          {text("length", "Run length, one way", "any unit: 6 m, 18 ft, 5 ft 6 in")}
          {parsed.ok && parsed.request.powerW !== undefined ? text("efficiency", "Efficiency", "an inverter about 90 %; lamps and heaters 100 %") : null}
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
              <InsulationOptions />
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
          {v.returnPath === "chassis" ? text("returnResistance", "Chassis return", "measured: 0.12 V at 80 A, or 1.5 mOhm; empty: 1 mOhm (common practice)") : null}
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Conductor</span>
            <select className={input} value={v.material} onChange={set("material")} data-testid="size-material">
              {MATERIAL_IDS.map((m) => (
                <option key={m} value={m}>
                  {MATERIALS[m].name}
                </option>
              ))}
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Ampacity from</span>
            <select className={input} value={v.basis} onChange={set("basis")} data-testid="size-basis">
              <option value="marine-table">Marine table (33 CFR 183.425)</option>
              <option value="heat-balance">Heat balance, cable in still air</option>
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-medium text-graphite-800">Protect with</span>
            <select className={input} value={v.device} onChange={set("device")} data-testid="size-device">
              <option value="fuse">A fuse (blade or bolt-in)</option>
              <option value="breaker">A circuit breaker (SAE J553)</option>
            </select>
          </label>
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
          {text("inrush", "Start-up surge (optional)", "a motor's inrush: 600 A for 0.5 s")}
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
                      {answer.protection.name}
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
                      <td className="px-3 py-1.5 text-graphite-700">{c.ok ? (c.size === answer.recommended?.size ? "chosen" : "") : c.governing ? FAILS_ON[c.governing] : ""}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <p className="px-3 py-2 text-xs text-graphite-500">
                * not a row of 33 CFR 183.425 Table 5; interpolated in circular mils. &ldquo;May carry&rdquo; is the table value after the ambient, bundle and
                material factors. Ampacity basis: {answer.ampacityBasis}.
              </p>
            </div>
            {plotted ? <DropChart answer={plotted} /> : null}
            {plotted ? <DeviceCurveChart answer={plotted} /> : null}
            <SaveSizing
              inputs={Object.fromEntries(new URLSearchParams(queryFromInputs(v)))}
              request={parsed.ok ? parsed.request : null}
              suggestedTitle={`${v.current.trim()} over ${v.length.trim()}${answer.recommended ? `: ${answer.recommended.size}` : ""}`}
            />
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
