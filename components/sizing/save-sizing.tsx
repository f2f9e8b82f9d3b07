"use client";

import Link from "next/link";
import { useForm } from "react-hook-form";
import type { SizingRequest } from "@/lib/conductors";
import { authClient } from "@/lib/auth/client";
import { useJobs, useSaveSizing } from "@/lib/hooks/jobs";
import { ApiClientError } from "@/lib/query/client";

type Values = { jobId: string; title: string };

/**
 * Keeps the sizing on screen with a job: its inputs (to reopen it here) and the answer, which the server works out
 * again. Signed out, it says how to get there; with no job to write to, it says so.
 */
export function SaveSizing(props: { inputs: Record<string, string>; request: SizingRequest | null; suggestedTitle: string }) {
  const session = authClient.useSession();
  const signedIn = Boolean(session.data?.user);
  const jobs = useJobs({ sort: "updated", dir: "desc", limit: 50 }, { enabled: signedIn });
  const save = useSaveSizing();
  const form = useForm<Values>({ defaultValues: { jobId: "", title: "" } });
  const editable = (jobs.data?.jobs ?? []).filter((j) => j.canEdit);
  const here = typeof window === "undefined" ? "/size" : `/size${window.location.search}`;

  if (session.isPending) return null;
  if (!signedIn || (jobs.error instanceof ApiClientError && jobs.error.status === 401)) {
    return (
      <p className="rounded-lg border border-graphite-100 bg-paper-raised p-4 text-sm text-graphite-700" data-testid="size-save-signed-out">
        <Link href={`/sign-in?next=${encodeURIComponent(here)}`} className="font-medium text-copper-700 underline">
          Sign in
        </Link>{" "}
        to keep this sizing with a job; it then shows on the job and in its report.
      </p>
    );
  }
  if (jobs.isPending || jobs.error) return null;
  if (!editable.length) {
    return <p className="rounded-lg border border-graphite-100 bg-paper-raised p-4 text-sm text-graphite-700">Open a job first to keep sizings with it.</p>;
  }
  const saved = save.data?.sizing;
  return (
    <form
      className="rounded-lg border border-graphite-100 bg-paper-raised p-4"
      onSubmit={form.handleSubmit((v) => {
        if (!props.request) return;
        save.mutate({ jobId: v.jobId || editable[0].id, body: { title: v.title.trim() || props.suggestedTitle, inputs: props.inputs, request: props.request } });
      })}
      data-testid="size-save"
    >
      <h2 className="text-sm font-semibold">Keep with a job</h2>
      <div className="mt-2 grid gap-2 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto] sm:items-end">
        <label className="block text-sm">
          <span className="text-graphite-700">Job</span>
          <select {...form.register("jobId")} className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-2 py-1.5" data-testid="size-save-job">
            {editable.map((j) => (
              <option key={j.id} value={j.id}>
                {j.title}
                {j.vehicle ? `: ${j.vehicle}` : ""}
              </option>
            ))}
          </select>
        </label>
        <label className="block text-sm">
          <span className="text-graphite-700">Title</span>
          <input {...form.register("title")} placeholder={props.suggestedTitle} maxLength={120} className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-2 py-1.5" data-testid="size-save-title" />
        </label>
        <button type="submit" disabled={!props.request || save.isPending} className="rounded-md bg-copper-600 px-4 py-2 text-sm font-medium text-white disabled:opacity-40" data-testid="size-save-button">
          {save.isPending ? "Saving..." : "Save"}
        </button>
      </div>
      {save.error ? (
        <p className="mt-2 text-sm text-over" role="alert">
          {save.error.message}
          {save.error.issues.length ? `: ${save.error.issues.map((i) => `${i.path} ${i.message}`).join("; ")}` : ""}
        </p>
      ) : saved ? (
        <p className="mt-2 text-sm text-within" role="status" data-testid="size-saved">
          Saved &ldquo;{saved.title}&rdquo; ({saved.answer.size ?? "no size fits"}) to{" "}
          <Link href={`/jobs/${saved.jobId}`} className="underline">
            {editable.find((j) => j.id === saved.jobId)?.title ?? "the job"}
          </Link>
          .
        </p>
      ) : null}
    </form>
  );
}
