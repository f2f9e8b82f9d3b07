"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { IssueList } from "@/components/jobs/job-detail";
import { SafetyNote } from "@/components/ui/safety-note";
import { Unavailable } from "@/components/ui/unavailable";
import { CircuitExplorer } from "@/components/workspace/workspace";
import { formatWhen } from "@/lib/format";
import { useCopyLesson, useDeleteLesson, useLesson, useLessonActivity, type LessonDetail } from "@/lib/hooks/lessons";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const secondary = "rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100 disabled:opacity-50";
const th = "px-3 py-2 text-left font-semibold";
const td = "px-3 py-2";

/** One lesson: its brief and questions, the circuit explored read-only with the live solve, and a way to copy it. */
export function LessonView({ id }: { id: string }) {
  const [version, setVersion] = useState<number | undefined>(undefined);
  const { data, error, isPending } = useLesson(id, version);
  if (isPending) return <p className="mx-auto max-w-7xl px-4 py-8 text-graphite-500 sm:px-6">Opening the lesson...</p>;
  if (error) return <Unavailable title="This lesson cannot be shown" message={error.message} testId="lesson-missing" className="mx-auto max-w-3xl px-4 py-10" />;
  const { lesson, snapshot } = data;
  const isLatest = snapshot.version === lesson.latestVersion;
  return (
    <div>
      <div className="mx-auto max-w-7xl px-4 pt-8 sm:px-6">
        <p className="text-sm">
          <Link href="/lessons" className="font-medium text-copper-700 underline-offset-2 hover:underline">
            Lessons
          </Link>{" "}
          <span className="text-graphite-500">/ {lesson.organizationName}</span>
        </p>
        <div className="mt-3 flex flex-wrap items-start justify-between gap-4">
          <div className="min-w-0">
            <h1 className="text-3xl font-semibold tracking-tight" data-testid="lesson-heading">
              {snapshot.title}
            </h1>
            <p className="mt-1 text-graphite-700" data-testid="lesson-version">
              Version {snapshot.version}
              {isLatest ? " (latest)" : ` of ${lesson.latestVersion}`} · published {formatWhen(snapshot.publishedAt)}
              {snapshot.publishedByName ? ` by ${snapshot.publishedByName}` : ""}
            </p>
          </div>
          <div className="flex flex-wrap items-center gap-2">
            {data.versions.length > 1 ? (
              <label className="text-sm">
                <span className="mr-1 text-graphite-700">Version</span>
                <select value={snapshot.version} onChange={(e) => setVersion(Number(e.target.value))} className="rounded border border-graphite-300 bg-white px-2 py-1" data-testid="lesson-version-pick">
                  {data.versions.map((v) => (
                    <option key={v.version} value={v.version}>
                      {v.version}, {formatWhen(v.publishedAt)}
                    </option>
                  ))}
                </select>
              </label>
            ) : null}
            <CopyButton data={data} />
          </div>
        </div>
        {!isLatest ? (
          <p className="mt-3 rounded-md bg-caution-soft px-3 py-2 text-sm" role="status" data-testid="lesson-old-version">
            This is an earlier version, kept as it was published.{" "}
            <button type="button" className="font-medium underline" onClick={() => setVersion(lesson.latestVersion)}>
              Open the latest
            </button>
          </p>
        ) : null}
        <div className="mt-4 grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
          <div className={`${box} p-5`}>
            <h2 className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Brief</h2>
            <p className="mt-1 whitespace-pre-line" data-testid="lesson-brief-text">
              {snapshot.brief || "No brief: explore the circuit, choose each operating state and colour it by voltage drop."}
            </p>
            {snapshot.questions.length ? (
              <>
                <h2 className="mt-4 text-xs font-semibold uppercase tracking-wider text-graphite-500">Questions</h2>
                <ol className="mt-1 list-decimal space-y-1 pl-5" data-testid="lesson-questions">
                  {snapshot.questions.map((q, i) => (
                    <li key={i}>{q.prompt}</li>
                  ))}
                </ol>
              </>
            ) : null}
          </div>
          <SafetyNote compact />
        </div>
        {lesson.canManage ? <InstructorPanel data={data} /> : null}
      </div>
      <div className="mt-6 border-t border-graphite-100" data-testid="lesson-explorer">
        <CircuitExplorer key={snapshot.version} document={snapshot.document} readOnlyNote={lesson.canCopy ? "Read only: make your own copy to change it" : "Read only"} />
      </div>
    </div>
  );
}

/** "Make my copy": a job and circuit of the person's own in the class, opened in the workspace. */
function CopyButton({ data }: { data: LessonDetail }) {
  const copy = useCopyLesson(data.lesson.id);
  const router = useRouter();
  if (!data.lesson.canCopy) return null;
  return (
    <div className="flex flex-wrap items-center gap-2">
      {data.lesson.myCopyJobId ? (
        <Link href={`/jobs/${data.lesson.myCopyJobId}`} className={secondary} data-testid="lesson-my-copy">
          Open my copy
        </Link>
      ) : null}
      <button
        type="button"
        disabled={copy.isPending}
        onClick={() => copy.mutate(data.snapshot.version, { onSuccess: (r) => router.push(r.copy.url) })}
        className="rounded-md bg-copper-600 px-3 py-1.5 text-sm font-semibold text-white hover:bg-copper-700 disabled:opacity-60"
        data-testid="lesson-copy"
      >
        {copy.isPending ? "Copying..." : data.lesson.myCopyJobId ? "Make another copy" : "Make my copy"}
      </button>
      {copy.error ? (
        <div className="basis-full">
          <IssueList error={copy.error} />
        </div>
      ) : null}
    </div>
  );
}

/** For the class's instructors: who opened the lesson and who copied it, the source circuit, and withdrawing it. */
function InstructorPanel({ data }: { data: LessonDetail }) {
  const activity = useLessonActivity(data.lesson.id, true);
  const remove = useDeleteLesson(data.lesson.id);
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const people = activity.data?.people ?? [];
  const students = people.filter((p) => p.role === "student");
  return (
    <section className={`${box} mt-4 p-5`} aria-labelledby="activity-h" data-testid="lesson-activity">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="activity-h" className="font-semibold">
          Who has opened it{students.length ? `: ${students.filter((s) => s.openCount > 0).length} of ${students.length} students, ${students.filter((s) => s.copiedAt).length} copied` : ""}
        </h2>
        <div className="flex flex-wrap gap-2 text-sm">
          {data.lesson.sourceCircuitId ? (
            <Link href={`/circuits/${data.lesson.sourceCircuitId}`} className={secondary} data-testid="lesson-source">
              Source circuit (publish again)
            </Link>
          ) : null}
          {confirming ? (
            <>
              <button type="button" className="rounded-md bg-over px-3 py-1.5 font-semibold text-white" onClick={() => remove.mutate(undefined, { onSuccess: () => router.push("/lessons") })} data-testid="lesson-withdraw-confirm">
                Withdraw every version
              </button>
              <button type="button" className={secondary} onClick={() => setConfirming(false)}>
                Keep it
              </button>
            </>
          ) : (
            <button type="button" className={`${secondary} text-over`} onClick={() => setConfirming(true)} data-testid="lesson-withdraw">
              Withdraw
            </button>
          )}
        </div>
      </div>
      {confirming ? <p className="mt-2 text-sm text-graphite-700">The class will no longer see this lesson. Copies students made stay theirs.</p> : null}
      <IssueList error={activity.error ?? remove.error} />
      <div className="mt-3 overflow-x-auto">
        <table className="w-full min-w-[560px] text-sm" data-testid="lesson-activity-table">
          <thead className="bg-graphite-100/60">
            <tr>
              <th className={th}>Person</th>
              <th className={th}>Role</th>
              <th className={th}>Opened</th>
              <th className={th}>Last opened</th>
              <th className={th}>Copy</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {people.map((p) => (
              <tr key={p.userId} data-testid="lesson-activity-row">
                <td className={`${td} font-medium`}>{p.name}</td>
                <td className={td}>{p.roleLabel}</td>
                <td className={`${td} tabular-nums`}>{p.openCount ? `${p.openCount} ${p.openCount === 1 ? "time" : "times"}` : <span className="text-graphite-500">not yet</span>}</td>
                <td className={td}>{p.lastOpenedAt ? `${formatWhen(p.lastOpenedAt)}, version ${p.lastVersion}` : "-"}</td>
                <td className={td}>
                  {p.copiedAt && p.copyJobId ? (
                    <Link href={`/jobs/${p.copyJobId}`} className="text-copper-700 underline-offset-2 hover:underline">
                      ✓ {formatWhen(p.copiedAt)}
                    </Link>
                  ) : p.copiedAt ? (
                    `✓ ${formatWhen(p.copiedAt)}`
                  ) : (
                    "-"
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
