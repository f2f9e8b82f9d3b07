"use client";

import { Unavailable } from "@/components/ui/unavailable";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { ReadingPhotos } from "@/components/jobs/attachments";
import { IssueList } from "@/components/jobs/job-detail";
import { PublishLesson } from "@/components/lessons/publish-lesson";
import { SafetyNote } from "@/components/ui/safety-note";
import { formatDocument, loadCircuit, stateIdsOf, terminalsOf, type CircuitDocument } from "@/lib/circuit";
import { checkReadings, type ReadingCheck } from "@/lib/diagnosis/compare";
import { locateFault } from "@/lib/diagnosis/locate";
import { formatVolts, formatWhen } from "@/lib/format";
import { staleVersionOf, useCircuit, useCreateReading, useDeleteReading, useReadings, useSaveCircuit, type Circuit } from "@/lib/hooks/circuits";
import { createReadingInput, type CreateReadingInput } from "@/lib/validators/work";
import { ConflictDialog } from "./conflict-dialog";
import { describeComponent, describeWire, stateName, terminalLabel } from "./describe";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const th = "px-3 py-2 text-left font-semibold";
const td = "px-3 py-2 align-top";

/** One circuit of a job: its parts and cables, the readings taken on it, and its document with versioned saves. */
export function CircuitView({ id }: { id: string }) {
  const { data, error, isPending } = useCircuit(id);
  if (isPending) return <p className="text-graphite-500">Loading the circuit...</p>;
  if (error) return <Unavailable title="This circuit cannot be shown" message={error.message} testId="circuit-missing" />;
  const { circuit, canEdit } = data;
  const doc = circuit.document;
  return (
    <div>
      <p className="text-sm">
        <Link href="/jobs" className="font-medium text-copper-700 underline-offset-2 hover:underline">
          Jobs
        </Link>{" "}
        /{" "}
        <Link href={`/jobs/${circuit.jobId}`} className="font-medium text-copper-700 underline-offset-2 hover:underline" data-testid="back-to-job">
          {circuit.jobTitle}
        </Link>{" "}
        <span className="text-graphite-500">/ {circuit.name}</span>
      </p>
      <div className="mt-3 flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 className="text-3xl font-semibold tracking-tight" data-testid="circuit-heading">
            {circuit.name}
          </h1>
          <p className="mt-1 text-graphite-700" data-testid="circuit-version">
            Version {circuit.version} · {doc.systemVoltage} V system · saved {formatWhen(circuit.updatedAt)}
            {circuit.updatedByName ? ` by ${circuit.updatedByName}` : ""}
          </p>
        </div>
        <div className="flex flex-wrap gap-2 text-sm">
          <Link href={`/circuits/${id}/workspace`} className="rounded-md bg-copper-600 px-3 py-1.5 font-semibold text-white hover:bg-copper-700" data-testid="workspace-link">
            Open in the workspace
          </Link>
          <Link href={`/circuits/${id}/plan`} className="rounded-md border border-copper-600 px-3 py-1.5 font-medium text-copper-700 hover:bg-copper-50" data-testid="plan-link">
            Follow a test plan
          </Link>
          <Link href={`/circuits/${id}/history`} className="rounded-md border border-graphite-300 px-3 py-1.5 font-medium hover:bg-graphite-100" data-testid="history-link">
            History
          </Link>
          <a href={`/api/v1/circuits/${id}/export`} className="rounded-md border border-graphite-300 px-3 py-1.5 font-medium hover:bg-graphite-100" data-testid="export-link">
            Download (.json)
          </a>
          <a href={`/api/v1/circuits/${id}/readings.csv`} className="rounded-md border border-graphite-300 px-3 py-1.5 font-medium hover:bg-graphite-100" data-testid="readings-csv-link">
            Readings (.csv)
          </a>
          <a href={`/api/v1/circuits/${id}/results.csv`} className="rounded-md border border-graphite-300 px-3 py-1.5 font-medium hover:bg-graphite-100" data-testid="results-csv-link">
            Results (.csv)
          </a>
        </div>
      </div>

      <PartsTables doc={doc} />
      <ReadingsSection circuit={circuit} canEdit={canEdit} />
      <PublishLesson circuitId={circuit.id} circuitName={circuit.name} />
      {canEdit ? <DocumentEditor circuit={circuit} /> : null}
    </div>
  );
}

function PartsTables({ doc }: { doc: CircuitDocument }) {
  return (
    <section className="mt-8 grid gap-6 lg:grid-cols-2" aria-label="Parts and cables">
      <div>
        <h2 className="text-lg font-semibold">Parts ({doc.components.length})</h2>
        <div className={`${box} mt-2 overflow-x-auto`}>
          <table className="w-full text-sm" data-testid="parts-table">
            <thead className="bg-graphite-100/60">
              <tr>
                <th className={th}>Id</th>
                <th className={th}>What</th>
                <th className={th}>Settings</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-graphite-100">
              {doc.components.map((c) => (
                <tr key={c.id}>
                  <td className={`${td} font-mono`}>{c.id}</td>
                  <td className={td}>
                    {c.label ?? c.kind} <span className="text-graphite-500">({c.kind})</span>
                  </td>
                  <td className={td}>{describeComponent(c)}</td>
                </tr>
              ))}
              {doc.components.length === 0 ? (
                <tr>
                  <td colSpan={3} className={`${td} text-graphite-500`}>
                    No parts yet. Draw them in the workspace.
                  </td>
                </tr>
              ) : null}
            </tbody>
          </table>
        </div>
      </div>
      <div>
        <h2 className="text-lg font-semibold">Cables and connections ({doc.wires.length})</h2>
        <div className={`${box} mt-2 overflow-x-auto`}>
          <table className="w-full text-sm" data-testid="wires-table">
            <thead className="bg-graphite-100/60">
              <tr>
                <th className={th}>Id</th>
                <th className={th}>From → to</th>
                <th className={th}>Conductor</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-graphite-100">
              {doc.wires.map((w) => (
                <tr key={w.id}>
                  <td className={`${td} font-mono`}>{w.id}</td>
                  <td className={td}>
                    {w.label ? <span className="block font-medium">{w.label}</span> : null}
                    <span className="font-mono text-xs">
                      {w.from} → {w.to}
                    </span>
                  </td>
                  <td className={td}>{describeWire(w)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {doc.states?.length ? (
          <p className="mt-2 text-sm text-graphite-700">
            Operating states: Base (as drawn), {doc.states.map((s) => s.name).join(", ")}.
          </p>
        ) : null}
      </div>
    </section>
  );
}

function ReadingsSection({ circuit, canEdit }: { circuit: Circuit; canEdit: boolean }) {
  const doc = circuit.document;
  const readings = useReadings(circuit.id);
  const remove = useDeleteReading(circuit.id);
  const checks = useMemo(() => new Map(checkReadings(doc, readings.data ?? []).map((c) => [c.id, c])), [doc, readings.data]);
  return (
    <section className="mt-10" aria-labelledby="readings-h">
      <h2 id="readings-h" className="text-xl font-semibold">
        Readings
      </h2>
      <p className="mt-1 text-sm text-graphite-700">Red lead on the first point, black on the second, in the operating state named. Drops mean something only with current flowing.</p>
      <div className={`${box} mt-3 overflow-x-auto`}>
        <table className="w-full min-w-[1000px] text-sm" data-testid="readings-table">
          <thead className="bg-graphite-100/60">
            <tr>
              <th className={th}>State</th>
              <th className={th}>Red lead</th>
              <th className={th}>Black lead</th>
              <th className={`${th} text-right`}>Reading</th>
              <th className={`${th} text-right`}>Clamp</th>
              <th className={`${th} text-right`}>Model</th>
              <th className={th}>Against the model</th>
              <th className={th}>Note</th>
              <th className={th}>Photos</th>
              <th className={th}>Taken</th>
              {canEdit ? <th className={th}><span className="sr-only">Remove</span></th> : null}
            </tr>
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {(readings.data ?? []).map((r) => (
              <tr key={r.id} data-testid="reading-row">
                <td className={td}>{stateName(doc, r.stateId)}</td>
                <td className={td}>{terminalLabel(doc, r.positive)}</td>
                <td className={td}>{terminalLabel(doc, r.negative)}</td>
                <td className={`${td} whitespace-nowrap text-right font-semibold tabular-nums`}>{formatVolts(r.value, r.unit)}</td>
                <td className={`${td} whitespace-nowrap text-right tabular-nums`}>{r.currentA !== null ? `${r.currentA} A` : "-"}</td>
                <td className={`${td} whitespace-nowrap text-right tabular-nums text-graphite-700`}>
                  {checks.get(r.id)?.expectedV !== undefined ? formatVolts(checks.get(r.id)!.expectedV!) : "-"}
                </td>
                <td className={`${td} min-w-56`} data-testid="reading-verdict">
                  <Verdict check={checks.get(r.id)} />
                </td>
                <td className={td}>{r.note}</td>
                <td className={td}>
                  <ReadingPhotos jobId={circuit.jobId} readingId={r.id} canEdit={canEdit} />
                </td>
                <td className={`${td} text-graphite-700`}>
                  {formatWhen(r.takenAt)}
                  {r.takenByName ? <span className="block text-xs">{r.takenByName}</span> : null}
                </td>
                {canEdit ? (
                  <td className={td}>
                    <button type="button" className="text-over underline-offset-2 hover:underline" onClick={() => remove.mutate(r.id)} aria-label={`Remove the reading of ${formatVolts(r.value, r.unit)}`}>
                      Remove
                    </button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
        {readings.data?.length === 0 ? <p className="px-4 py-5 text-graphite-700" data-testid="readings-empty">No readings yet.{canEdit ? " Record the first one below." : ""}</p> : null}
      </div>
      <IssueList error={remove.error} />
      <Suspects doc={doc} readings={readings.data ?? []} />
      {canEdit ? (
        <>
          {doc.components.length ? <ReadingForm circuit={circuit} /> : null}
          <div className="mt-4">
            <SafetyNote compact />
          </div>
        </>
      ) : null}
    </section>
  );
}

/** Where the readings put resistance the model does not have, ranked, with the next point to probe. */
function Suspects({ doc, readings }: { doc: CircuitDocument; readings: Parameters<typeof locateFault>[1] }) {
  const loc = useMemo(() => locateFault(doc, readings), [doc, readings]);
  if (!loc.used.length) return null;
  const name = (id: string) => doc.components.find((c) => c.id === id)?.label ?? doc.wires.find((w) => w.id === id)?.label ?? id;
  return (
    <div className="mt-4 rounded-lg border border-graphite-100 bg-paper-raised p-4" data-testid="suspects">
      <h3 className="font-semibold">Where the readings put extra resistance</h3>
      <p className="text-xs text-graphite-700">
        From the {loc.used.length} {loc.used.length === 1 ? "reading" : "readings"} that span one current through cables and connections, by least squares with no
        negative resistance; the model is the circuit as drawn.
      </p>
      {loc.suspects.length === 0 ? (
        <p className="mt-2 text-sm text-within">None: these readings fit the circuit as drawn.</p>
      ) : (
        <ol className="mt-2 list-decimal space-y-1 pl-5 text-sm">
          {loc.suspects.map((s) => (
            <li key={s.id}>
              <span className="font-semibold">
                {s.id} ({name(s.id)})
              </span>
              : about {mOhm(s.extraOhm)} more than drawn, from {s.readings} {s.readings === 1 ? "reading" : "readings"}
              {s.twins.length ? <span className="text-graphite-700"> (cannot yet be told apart from {s.twins.join(", ")})</span> : null}
            </li>
          ))}
        </ol>
      )}
      {loc.probeNext ? (
        <p className="mt-2 text-sm" data-testid="probe-next">
          <span className="font-semibold">Probe next:</span> {loc.probeNext.why}
        </p>
      ) : null}
    </div>
  );
}

const mOhm = (ohm: number) => `${(ohm * 1000).toFixed(ohm < 0.01 ? 2 : 1)} mΩ`;

/** A reading's verdict against the model, in words, and what it says about the resistance between the probes. */
function Verdict({ check }: { check: ReadingCheck | undefined }) {
  if (!check) return null;
  const word = {
    "as-predicted": <span className="font-semibold text-within">as the model predicts</span>,
    higher: <span className="font-semibold text-over">▲ higher than predicted</span>,
    lower: <span className="font-semibold text-caution">▼ lower than predicted</span>,
    "no-model": <span className="text-graphite-500">no prediction: {check.reason}</span>,
  }[check.verdict];
  const p = check.path;
  return (
    <div>
      {word}
      {check.differenceV !== undefined && check.verdict !== "as-predicted" ? <span className="text-graphite-700"> ({check.differenceV > 0 ? "+" : ""}{formatVolts(check.differenceV)})</span> : null}
      {p ? (
        <p className="mt-0.5 text-xs text-graphite-700">
          {p.ids.join(", ")}: model {mOhm(p.expectedOhm)}, the reading gives {mOhm(p.impliedOhm)} at {p.currentA.toFixed(1)} A ({p.currentFrom === "clamp" ? "clamp" : "model's current"})
          {p.excessOhm > 0.00005 ? `: ${mOhm(p.excessOhm)} extra, ${p.excessHeatW.toFixed(1)} W of heat` : ""}
        </p>
      ) : check.pathNote && check.verdict !== "no-model" && !check.battery ? (
        <p className="mt-0.5 text-xs text-graphite-500">{check.pathNote}</p>
      ) : null}
      {check.battery?.kind === "rest" ? (
        <p className="mt-0.5 text-xs text-graphite-700" data-testid="soc">
          At rest: about {Math.round(check.battery.socPercent)} % charged (BCI table, flooded lead-acid near 27 °C).
          {check.battery.socPercent < 75 ? " Charge it before testing further: a low battery misleads every other test." : ""}
        </p>
      ) : check.battery?.kind === "charging" ? (
        <p className={`mt-0.5 text-xs ${check.battery.within ? "text-graphite-700" : "font-semibold text-over"}`} data-testid="charging-window">
          Charging voltage {check.battery.within ? "inside" : "outside"} the window of {check.battery.window[0].toFixed(2)} to {check.battery.window[1].toFixed(2)} V at the
          circuit&rsquo;s {check.battery.tempC} °C (common practice, widened for temperature; the maker&rsquo;s figure comes first).
        </p>
      ) : null}
      {p?.heatWarning ? (
        <p className="mt-0.5 text-xs font-semibold text-over" role="note">
          {p.heatWarning}
        </p>
      ) : null}
    </div>
  );
}

function ReadingForm({ circuit }: { circuit: Circuit }) {
  const doc = circuit.document;
  const terminals = terminalsOf(doc);
  const states = stateIdsOf(doc);
  const create = useCreateReading(circuit.id);
  const form = useForm<CreateReadingInput>({
    resolver: zodResolver(createReadingInput),
    defaultValues: { stateId: states[1] ?? "base", positive: terminals[0], negative: terminals[1] ?? terminals[0], unit: "V", note: "" },
  });
  const errors = form.formState.errors;
  const select = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-2 py-2";
  return (
    <form
      className={`${box} mt-4 grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-4`}
      onSubmit={form.handleSubmit((v) => create.mutate(v, { onSuccess: () => form.reset({ ...v, value: "" as unknown as number, currentA: "" as unknown as number, note: "" }) }))}
      noValidate
      data-testid="reading-form"
    >
      <label className="text-sm font-medium">
        Operating state
        <select className={select} {...form.register("stateId")} data-testid="reading-state">
          {states.map((s) => (
            <option key={s} value={s}>
              {stateName(doc, s)}
            </option>
          ))}
        </select>
      </label>
      <label className="text-sm font-medium">
        Red lead on
        <select className={select} {...form.register("positive")} data-testid="reading-positive">
          {terminals.map((t) => (
            <option key={t} value={t}>
              {terminalLabel(doc, t)}
            </option>
          ))}
        </select>
        {errors.positive ? <span className="text-over">{errors.positive.message}</span> : null}
      </label>
      <label className="text-sm font-medium">
        Black lead on
        <select className={select} {...form.register("negative")} data-testid="reading-negative">
          {terminals.map((t) => (
            <option key={t} value={t}>
              {terminalLabel(doc, t)}
            </option>
          ))}
        </select>
      </label>
      <div className="grid grid-cols-[1fr_auto] gap-2">
        <label className="text-sm font-medium">
          Meter shows
          <input type="text" inputMode="decimal" autoComplete="off" className={select} {...form.register("value")} data-testid="reading-value" />
          {errors.value ? <span className="text-over" role="alert">{errors.value.message}</span> : null}
        </label>
        <label className="text-sm font-medium">
          Unit
          <select className={select} {...form.register("unit")} data-testid="reading-unit">
            <option value="V">V</option>
            <option value="mV">mV</option>
          </select>
        </label>
      </div>
      <label className="text-sm font-medium">
        Clamp meter, A (optional)
        <input type="text" inputMode="decimal" autoComplete="off" className={select} {...form.register("currentA")} data-testid="reading-current" />
        {errors.currentA ? <span className="text-over">{errors.currentA.message}</span> : null}
      </label>
      <label className="text-sm font-medium sm:col-span-2">
        Note
        <input className={select} placeholder="Engine speed, loads on, what you saw" {...form.register("note")} data-testid="reading-note" />
      </label>
      <div className="flex items-end">
        <button type="submit" className="w-full rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" disabled={create.isPending} data-testid="reading-save">
          Record the reading
        </button>
      </div>
      <div className="sm:col-span-2 lg:col-span-4">
        <IssueList error={create.error} />
      </div>
    </form>
  );
}

/**
 * The circuit document as text, for pasting or fixing by hand beside the workspace: edit it and save a new version. The save names the
 * version it was edited from; if someone saved since, the compare dialog opens.
 */
function DocumentEditor({ circuit }: { circuit: Circuit }) {
  const [text, setText] = useState(() => formatDocument(circuit.document));
  // The version the text was loaded from: the save names it, never whatever version the page shows later.
  const [base, setBase] = useState(circuit.version);
  const [message, setMessage] = useState("");
  const [local, setLocal] = useState<{ message: string; issues?: { path: string; message: string }[] } | null>(null);
  const [pending, setPending] = useState<CircuitDocument | null>(null);
  const save = useSaveCircuit(circuit.id);
  const stale = staleVersionOf(save.error);

  const load = (doc: CircuitDocument, version: number) => {
    setText(formatDocument(doc));
    setBase(version);
    setPending(null);
    save.reset();
  };
  const submit = () => {
    setLocal(null);
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (e) {
      setLocal({ message: `The document is not valid JSON: ${e instanceof Error ? e.message : "check brackets and commas"}. Nothing was saved.` });
      return;
    }
    const loaded = loadCircuit(json);
    if (!loaded.ok) {
      setLocal({ message: "The document has problems; nothing was saved.", issues: loaded.issues });
      return;
    }
    setPending(loaded.document);
    save.mutate(
      { document: loaded.document, baseVersion: base, message: message.trim() || undefined },
      {
        onSuccess: (res) => {
          setBase(res.version);
          setPending(null);
        },
      },
    );
  };

  return (
    <details className={`${box} mt-10 p-4`} data-testid="document-editor">
      <summary className="cursor-pointer font-semibold">Edit the circuit document as text (JSON)</summary>
      <p className="mt-2 text-sm text-graphite-700">
        Each save is a new version; the history keeps every one. If someone else saves first, you see both versions and choose.
      </p>
      <label className="mt-3 block text-sm font-medium" htmlFor="doc-text">
        Document, version {base}
      </label>
      {circuit.version !== base && !pending ? (
        <p className="mt-1 rounded-md border border-caution/40 bg-caution-soft px-3 py-2 text-sm" role="status" data-testid="doc-newer">
          Version {circuit.version} was saved{circuit.updatedByName ? ` by ${circuit.updatedByName}` : ""} since you opened this.{" "}
          <button type="button" className="font-semibold underline" onClick={() => load(circuit.document, circuit.version)}>
            Load version {circuit.version}
          </button>{" "}
          (drops your unsaved edits here).
        </p>
      ) : null}
      <textarea
        id="doc-text"
        value={text}
        onChange={(e) => setText(e.target.value)}
        spellCheck={false}
        rows={18}
        className="mt-1 w-full rounded-md border border-graphite-300 bg-white p-3 font-mono text-xs"
        data-testid="doc-text"
      />
      <div className="mt-3 flex flex-wrap items-end gap-3">
        <label className="min-w-0 flex-1 text-sm font-medium">
          What changed (optional)
          <input value={message} onChange={(e) => setMessage(e.target.value)} className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2" data-testid="doc-message" />
        </label>
        <button type="button" onClick={submit} disabled={save.isPending} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="doc-save">
          Save as a new version
        </button>
      </div>
      <div className="mt-3 space-y-2">
        {local ? <IssueList error={{ message: local.message, issues: local.issues ?? [] }} /> : null}
        {save.error && !stale ? <IssueList error={save.error} /> : null}
        {save.isSuccess ? <p className="text-sm text-within" role="status">Saved as version {save.data.version}.</p> : null}
      </div>
      {stale && pending ? (
        <ConflictDialog
          mine={pending}
          baseVersion={base}
          theirs={stale}
          busy={save.isPending}
          onReload={() => load(stale.document, stale.version)}
          onOverwrite={() =>
            save.mutate(
              { document: pending, baseVersion: stale.version, message: message.trim() || `Saved over version ${stale.version}` },
              {
                onSuccess: (res) => {
                  setBase(res.version);
                  setPending(null);
                },
              },
            )
          }
        />
      ) : null}
    </details>
  );
}
