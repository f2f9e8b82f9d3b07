"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import type { z } from "zod";
import { IssueList } from "@/components/jobs/job-detail";
import { formatWhen } from "@/lib/format";
import { useCircuitLesson, usePublishLesson, type CircuitLesson } from "@/lib/hooks/lessons";
import { publishLessonInput } from "@/lib/validators/lessons";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const input = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2";
const secondary = "rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100";

type Form = z.input<typeof publishLessonInput>;

/** For a class's instructors: publish this circuit to the class as a lesson, or publish it again as a new version. */
export function PublishLesson({ circuitId, circuitName }: { circuitId: string; circuitName: string }) {
  const { data } = useCircuitLesson(circuitId);
  const [open, setOpen] = useState(false);
  if (!data?.canPublish) return null;
  const lesson = data.lesson;
  return (
    <section className="mt-10" aria-labelledby="lesson-h" data-testid="publish-lesson">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="lesson-h" className="text-xl font-semibold">
          Lesson for the class
        </h2>
        {!open ? (
          <button type="button" className={secondary} onClick={() => setOpen(true)} data-testid="lesson-open-form">
            {lesson ? "Publish a new version" : "Publish as a lesson"}
          </button>
        ) : null}
      </div>
      <p className="mt-1 text-sm text-graphite-700" data-testid="lesson-status">
        {lesson ? (
          <>
            Published as{" "}
            <Link href={`/lessons/${lesson.id}`} className="font-medium text-copper-700 underline-offset-2 hover:underline" data-testid="lesson-link">
              {lesson.title}
            </Link>
            , version {lesson.latestVersion}
            {lesson.publishedAt ? `, ${formatWhen(lesson.publishedAt)}` : ""}. Changes to this circuit reach the class only when you publish again; earlier versions stay readable.
          </>
        ) : (
          "The class sees a frozen copy of the circuit as it is now, with your brief and questions, and can make its own copy to change."
        )}
      </p>
      {open ? <LessonForm circuitId={circuitId} circuitName={circuitName} lesson={lesson} onDone={() => setOpen(false)} /> : null}
    </section>
  );
}

function LessonForm({ circuitId, circuitName, lesson, onDone }: { circuitId: string; circuitName: string; lesson: CircuitLesson["lesson"]; onDone: () => void }) {
  const publish = usePublishLesson(circuitId);
  const form = useForm<Form>({
    resolver: zodResolver(publishLessonInput),
    defaultValues: { title: lesson?.title ?? circuitName, brief: lesson?.brief ?? "", questions: lesson?.questions ?? [] },
  });
  const questions = useFieldArray({ control: form.control, name: "questions" });
  const errors = form.formState.errors;
  return (
    <form className={`${box} mt-3 grid gap-4 p-5`} onSubmit={form.handleSubmit((v) => publish.mutate(v, { onSuccess: onDone }))} noValidate data-testid="lesson-form">
      <label className="text-sm font-medium">
        Title
        <input className={input} {...form.register("title")} aria-invalid={errors.title ? true : undefined} data-testid="lesson-title" />
        {errors.title ? <span className="mt-1 block text-sm text-over" role="alert">{errors.title.message}</span> : null}
      </label>
      <label className="text-sm font-medium">
        Brief
        <textarea
          className={input}
          rows={4}
          placeholder="What to look at first, which operating state to choose, what to predict before measuring"
          {...form.register("brief")}
          data-testid="lesson-brief"
        />
        {errors.brief ? <span className="mt-1 block text-sm text-over" role="alert">{errors.brief.message}</span> : null}
      </label>
      <fieldset>
        <legend className="text-sm font-medium">Questions (optional)</legend>
        <ol className="mt-1 grid gap-2">
          {questions.fields.map((f, i) => (
            <li key={f.id} className="flex items-start gap-2">
              <span className="mt-2 w-5 text-right text-sm text-graphite-500">{i + 1}.</span>
              <div className="flex-1">
                <input className={`${input} mt-0`} aria-label={`Question ${i + 1}`} {...form.register(`questions.${i}.prompt`)} data-testid="lesson-question" />
                {errors.questions?.[i]?.prompt ? <span className="mt-1 block text-sm text-over" role="alert">{errors.questions[i]?.prompt?.message}</span> : null}
              </div>
              <button type="button" className="mt-1 text-sm text-over underline-offset-2 hover:underline" onClick={() => questions.remove(i)} aria-label={`Remove question ${i + 1}`}>
                Remove
              </button>
            </li>
          ))}
        </ol>
        {questions.fields.length < 20 ? (
          <button type="button" className={`${secondary} mt-2`} onClick={() => questions.append({ prompt: "" })} data-testid="lesson-add-question">
            Add a question
          </button>
        ) : null}
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <button type="submit" disabled={publish.isPending} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="lesson-publish">
          {publish.isPending ? "Publishing..." : lesson ? `Publish version ${lesson.latestVersion + 1}` : "Publish to the class"}
        </button>
        <button type="button" className={secondary} onClick={onDone}>
          Cancel
        </button>
      </div>
      <IssueList error={publish.error} />
    </form>
  );
}
