import type { Drawing } from "@/lib/report/drawing";
import type { JobReport } from "@/lib/report/job-report";

const VERDICT_CLASS: Record<string, string> = { "as-predicted": "text-within", higher: "text-over font-semibold", lower: "text-caution font-semibold", "no-model": "text-graphite-500" };

/** The job report laid out for screen and paper: the same words and figures as the PDF. */
export function ReportView({ report, shared = false }: { report: JobReport; shared?: boolean }) {
  return (
    <article className="report mx-auto max-w-4xl bg-white px-6 py-8 text-graphite-900 print:max-w-none print:px-0 print:py-0" data-testid="job-report">
      <header className="border-b border-graphite-100 pb-4">
        <p className="text-xs font-semibold uppercase tracking-widest text-copper-700">{shared ? "Shared job report · read only" : "Job report"}</p>
        <h1 className="mt-1 text-3xl font-semibold tracking-tight" data-testid="report-title">
          {report.title}
        </h1>
        <p className="mt-1 text-sm text-graphite-700">
          {report.organizationName} · made {report.generated}
        </p>
        <dl className="mt-4 grid grid-cols-[8rem_1fr] gap-x-4 gap-y-1 text-sm">
          {report.facts.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="font-semibold text-graphite-700">{k}</dt>
              <dd>{v}</dd>
            </div>
          ))}
        </dl>
      </header>

      {(
        [
          ["Complaint", report.complaint],
          ["Found", report.findings],
          ["Repair", report.repair],
        ] as const
      ).map(([label, text]) =>
        text ? (
          <section key={label} className="mt-5 break-inside-avoid">
            <h2 className="text-lg font-semibold">{label}</h2>
            <p className="mt-1 whitespace-pre-line" data-testid={`report-${label.toLowerCase()}`}>
              {text}
            </p>
          </section>
        ) : null,
      )}

      {report.circuits.map((c) => (
        <section key={c.id} className="mt-8 break-before-auto" aria-label={c.name} data-testid="report-circuit">
          <h2 className="text-xl font-semibold">
            {c.name} <span className="text-sm font-normal text-graphite-500">version {c.version}</span>
          </h2>
          <CircuitDrawing drawing={c.drawing} title={c.name} />
          <h3 className="mt-4 font-semibold">Operating states</h3>
          <ul className="mt-1 space-y-0.5 text-sm">
            {c.states.map((s) => (
              <li key={s.id}>
                <span className="font-semibold">{s.name}:</span> {s.summary}
              </li>
            ))}
          </ul>
          <h3 className="mt-4 font-semibold">Readings ({c.readings.length})</h3>
          {c.readings.length === 0 ? (
            <p className="text-sm text-graphite-500">No readings taken on this circuit.</p>
          ) : (
            <table className="mt-1 w-full border-collapse text-sm" data-testid="report-readings">
              <thead>
                <tr className="border-b border-graphite-300 text-left text-xs uppercase tracking-wide text-graphite-700">
                  <th className="py-1 pr-2">State</th>
                  <th className="py-1 pr-2">Between</th>
                  <th className="py-1 pr-2">Measured</th>
                  <th className="py-1 pr-2">Expected</th>
                  <th className="py-1">Verdict</th>
                </tr>
              </thead>
              <tbody>
                {c.readings.map((r) => (
                  <tr key={r.id} className="break-inside-avoid border-b border-graphite-100 align-top">
                    <td className="py-1.5 pr-2">{r.state}</td>
                    <td className="py-1.5 pr-2">
                      {r.between}
                      <p className="text-xs text-graphite-500">
                        {[r.note, `taken ${r.taken}`, r.photos ? `${r.photos} photo${r.photos === 1 ? "" : "s"}` : ""].filter(Boolean).join(" · ")}
                      </p>
                    </td>
                    <td className="py-1.5 pr-2 font-mono text-xs">{r.measured}</td>
                    <td className="py-1.5 pr-2 font-mono text-xs text-graphite-700">{r.expected}</td>
                    <td className="py-1.5">
                      <span className={VERDICT_CLASS[r.verdict]}>{r.verdictText}</span>
                      {r.detail ? <p className="text-xs text-graphite-700">{r.detail}</p> : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {c.suspects.length || c.fitNote || c.probeNext ? (
            <div className="mt-4 break-inside-avoid rounded-md border border-graphite-100 p-3" data-testid="report-suspects">
              <h3 className="font-semibold">Where the readings put extra resistance</h3>
              {c.suspects.length ? (
                <ol className="mt-1 list-decimal pl-5 text-sm">
                  {c.suspects.map((s) => (
                    <li key={s}>{s}</li>
                  ))}
                </ol>
              ) : null}
              {c.fitNote ? <p className="mt-1 text-sm">{c.fitNote}</p> : null}
              {c.probeNext ? (
                <p className="mt-1 text-sm">
                  <span className="font-semibold">Probe next:</span> {c.probeNext}
                </p>
              ) : null}
            </div>
          ) : null}
        </section>
      ))}

      {report.sizings.length ? (
        <section className="mt-8 break-inside-avoid" data-testid="report-sizings">
          <h2 className="text-xl font-semibold">Cable and fuse sizing</h2>
          <ul className="mt-2 space-y-2 text-sm">
            {report.sizings.map((s) => (
              <li key={s.title}>
                <span className="font-semibold">{s.title}:</span> {s.line}
                <p className="text-xs text-graphite-700">{s.detail}</p>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section className="mt-8 break-inside-avoid rounded-md border border-caution/50 bg-caution-soft p-4 text-sm print:bg-white" role="note" aria-label="Cautions">
        <h2 className="font-semibold">Cautions</h2>
        <ul className="mt-1 list-disc space-y-0.5 pl-5">
          {report.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </section>
    </article>
  );
}

/** The circuit as boxes and cables, as placed on the canvas (an SVG that prints crisp at any size). */
export function CircuitDrawing({ drawing: d, title }: { drawing: Drawing; title: string }) {
  if (!d.parts.length) return <p className="mt-2 text-sm text-graphite-500">Nothing drawn yet.</p>;
  return (
    <svg viewBox={`0 0 ${d.width} ${d.height}`} className="mt-3 h-auto max-h-[28rem] w-full rounded-md border border-graphite-100 bg-white" role="img" aria-label={`Drawing of ${title}`} data-testid="report-drawing">
      {d.cables.map((c) => (
        <g key={c.id}>
          <polyline points={c.points.map((p) => p.join(",")).join(" ")} fill="none" stroke={c.kind === "link" ? "#68737d" : "#a65a24"} strokeWidth={c.kind === "link" ? 1.5 : 2.5} />
          <text x={c.mid[0] + 3} y={c.mid[1] - 4} fontSize={11} fill="#1d2125">
            {c.label}
          </text>
        </g>
      ))}
      {d.parts.map((p) => (
        <g key={p.id} opacity={p.off ? 0.55 : 1}>
          <rect x={p.x} y={p.y} width={p.w} height={p.h} rx={5} fill="#fff" stroke="#1d2125" strokeWidth={1.2} />
          <text x={p.x + 6} y={p.y + 15} fontSize={11} fontWeight={700} fill="#1d2125">
            {p.id}
          </text>
          <text x={p.x + p.w - 6} y={p.y + 15} fontSize={10} textAnchor="end" fill="#68737d">
            {p.off ? "off" : p.kind}
          </text>
          <text x={p.x + 6} y={p.y + 40} fontSize={11} fill="#1d2125">
            {p.label.length > 20 ? `${p.label.slice(0, 19)}…` : p.label}
          </text>
        </g>
      ))}
    </svg>
  );
}
