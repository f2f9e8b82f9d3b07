"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CircuitDocument } from "@/lib/circuit";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import type { PublishLessonInput } from "@/lib/validators/lessons";
import { jobKeys } from "./jobs";

export type LessonSummary = {
  id: string;
  organizationId: string;
  organizationName: string;
  latestVersion: number;
  sourceCircuitId: string | null;
  title: string;
  brief: string;
  questionCount: number;
  publishedAt: string;
  publishedByName: string | null;
  canManage: boolean;
  openedCount: number | null;
  copiedCount: number | null;
  myLastOpenedAt: string | null;
  myCopiedAt: string | null;
  myCopyJobId: string | null;
};

export type LessonSnapshot = {
  version: number;
  title: string;
  brief: string;
  questions: { prompt: string }[];
  document: CircuitDocument;
  publishedAt: string;
  publishedByName: string | null;
};

export type LessonDetail = {
  lesson: { id: string; organizationId: string; organizationName: string; latestVersion: number; sourceCircuitId: string | null; canManage: boolean; canCopy: boolean; myCopyJobId: string | null };
  snapshot: LessonSnapshot;
  versions: { version: number; title: string; publishedAt: string; publishedByName: string | null }[];
};

export type LessonPerson = {
  userId: string;
  name: string;
  role: string;
  roleLabel: string;
  openCount: number;
  firstOpenedAt: string | null;
  lastOpenedAt: string | null;
  lastVersion: number | null;
  copiedAt: string | null;
  copyJobId: string | null;
};

export type CircuitLesson = {
  canPublish: boolean;
  lesson: { id: string; latestVersion: number; title: string; brief: string; questions: { prompt: string }[]; publishedAt: string | null } | null;
};

/**
 * Everything about lessons except an opened snapshot: refetching that would count as opening it again, and a
 * snapshot never changes.
 */
const notSnapshots = { queryKey: ["lessons"], predicate: (q: { queryKey: readonly unknown[] }) => q.queryKey[1] !== "one" };

export const lessonKeys = {
  all: ["lessons"] as const,
  list: () => ["lessons", "list"] as const,
  one: (id: string, version?: number) => ["lessons", "one", id, version ?? "latest"] as const,
  activity: (id: string) => ["lessons", "activity", id] as const,
  ofCircuit: (circuitId: string) => ["lessons", "circuit", circuitId] as const,
};

export function useLessons() {
  return useQuery({ queryKey: lessonKeys.list(), queryFn: () => apiFetch<{ lessons: LessonSummary[] }>("/api/v1/lessons") });
}

export function useLesson(id: string, version?: number) {
  return useQuery({
    queryKey: lessonKeys.one(id, version),
    queryFn: () => apiFetch<LessonDetail>(`/api/v1/lessons/${id}${version ? `?version=${version}` : ""}`),
    staleTime: Infinity, // a snapshot never changes; opening it again is recorded once per visit
  });
}

export function useLessonActivity(id: string, enabled: boolean) {
  return useQuery({ queryKey: lessonKeys.activity(id), queryFn: () => apiFetch<{ people: LessonPerson[] }>(`/api/v1/lessons/${id}/activity`), enabled });
}

export function useCircuitLesson(circuitId: string) {
  return useQuery({ queryKey: lessonKeys.ofCircuit(circuitId), queryFn: () => apiFetch<CircuitLesson>(`/api/v1/circuits/${circuitId}/lesson`) });
}

export function usePublishLesson(circuitId: string) {
  const qc = useQueryClient();
  return useMutation<{ lesson: { id: string; version: number; url: string } }, ApiClientError, PublishLessonInput>({
    mutationFn: (json) => apiFetch(`/api/v1/circuits/${circuitId}/lesson`, { method: "POST", json }),
    onSuccess: () => qc.invalidateQueries(notSnapshots),
  });
}

export function useCopyLesson(id: string) {
  const qc = useQueryClient();
  return useMutation<{ copy: { jobId: string; circuitId: string; version: number; url: string } }, ApiClientError, number | undefined>({
    mutationFn: (version) => apiFetch(`/api/v1/lessons/${id}/copy${version ? `?version=${version}` : ""}`, { method: "POST" }),
    onSuccess: (r) => {
      // The open lesson learns of the copy without being fetched (and counted) again.
      qc.setQueriesData<LessonDetail>({ queryKey: ["lessons", "one", id] }, (d) => (d ? { ...d, lesson: { ...d.lesson, myCopyJobId: r.copy.jobId } } : d));
      return Promise.all([qc.invalidateQueries(notSnapshots), qc.invalidateQueries({ queryKey: jobKeys.all })]);
    },
  });
}

export function useDeleteLesson(id: string) {
  const qc = useQueryClient();
  return useMutation<unknown, ApiClientError, void>({
    mutationFn: () => apiFetch(`/api/v1/lessons/${id}`, { method: "DELETE" }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: ["lessons", "one", id] });
      return qc.invalidateQueries(notSnapshots);
    },
  });
}
