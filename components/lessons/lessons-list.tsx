"use client";

import Link from "next/link";
import { Unavailable } from "@/components/ui/unavailable";
import { formatWhen } from "@/lib/format";
import { useLessons } from "@/lib/hooks/lessons";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";

/** Lessons of the classes the person is in: what each is about, and what they (or, for instructors, the class) did with it. */
export function LessonsList() {
  const { data, error, isPending } = useLessons();
  if (isPending) return <p className="text-graphite-500">Loading lessons...</p>;
  if (error) return <Unavailable title="Lessons cannot be shown" message={error.message} testId="lessons-error" />;
  const list = data.lessons;
  return (
    <div>
      <h1 className="text-3xl font-semibold tracking-tight">Lessons</h1>
      <p className="mt-1 max-w-3xl text-graphite-700">
        Worked circuits your instructors published to the class. Open one to explore it with the live solve, then make your own copy to change it and practise measuring.
      </p>
      {list.length === 0 ? (
        <div className={`${box} mt-6 px-5 py-6 text-graphite-700`} data-testid="lessons-empty">
          <p>No lessons yet.</p>
          <p className="mt-1 text-sm">
            Instructors publish a lesson from any circuit of their class: open the circuit and choose &ldquo;Publish as a lesson&rdquo;. Students see lessons of the classes they were invited to.
          </p>
        </div>
      ) : (
        <ul className="mt-6 grid gap-4 md:grid-cols-2" data-testid="lesson-list">
          {list.map((l) => (
            <li key={l.id} className={`${box} flex flex-col p-5`} data-testid="lesson-card">
              <p className="text-xs font-semibold uppercase tracking-wider text-graphite-500">{l.organizationName}</p>
              <Link href={`/lessons/${l.id}`} className="mt-1 text-lg font-semibold text-copper-700 underline-offset-2 hover:underline" data-testid="lesson-card-link">
                {l.title}
              </Link>
              <p className="text-sm text-graphite-700">
                Version {l.latestVersion} · {formatWhen(l.publishedAt)}
                {l.publishedByName ? ` by ${l.publishedByName}` : ""}
                {l.questionCount ? ` · ${l.questionCount} ${l.questionCount === 1 ? "question" : "questions"}` : ""}
              </p>
              {l.brief ? <p className="mt-2 line-clamp-3 text-sm">{l.brief}</p> : null}
              <p className="mt-auto pt-3 text-sm" data-testid="lesson-card-status">
                {l.canManage ? (
                  <span className="text-graphite-700">
                    Opened by {l.openedCount} {l.openedCount === 1 ? "person" : "people"}, copied by {l.copiedCount}
                  </span>
                ) : l.myCopyJobId ? (
                  <Link href={`/jobs/${l.myCopyJobId}`} className="font-medium text-within underline-offset-2 hover:underline">
                    ✓ Your copy, {formatWhen(l.myCopiedAt!)}
                  </Link>
                ) : l.myLastOpenedAt ? (
                  <span className="text-graphite-700">Opened {formatWhen(l.myLastOpenedAt)}</span>
                ) : (
                  <span className="font-medium text-caution">Not opened yet</span>
                )}
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
