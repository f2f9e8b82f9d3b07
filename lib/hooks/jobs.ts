"use client";

import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import type { SizingRequest, SizingSummary } from "@/lib/conductors/sizing";
import type { SaveSizingBody } from "@/lib/validators/cable-size";
import type { CreateJobInput, JobStatus, UpdateJobInput } from "@/lib/validators/work";

export type Job = {
  id: string;
  organizationId: string;
  ownerId: string | null;
  ownerName: string | null;
  vehicleId: string | null;
  title: string;
  vehicle: string;
  systemVoltage: number;
  complaint: string;
  findings: string;
  repair: string;
  status: JobStatus;
  createdAt: string;
  updatedAt: string;
  updatedByName: string | null;
  canEdit: boolean;
  circuitCount?: number;
};

export type CircuitSummary = {
  id: string;
  jobId: string;
  name: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  updatedByName: string | null;
  components: number;
  wires: number;
  readingCount: number;
  lastReadingAt: string | null;
};

export type JobListParams = { organizationId?: string; q?: string; status?: JobStatus | ""; sort: "updated" | "created" | "title" | "status"; dir: "asc" | "desc"; limit: number; cursor?: string };
export type JobPage = {
  organization: { id: string; name: string; kind: "shop" | "class"; role: string };
  canCreate: boolean;
  jobs: Job[];
  nextCursor: string | null;
};

export const jobKeys = {
  all: ["jobs"] as const,
  list: (p: JobListParams) => ["jobs", "list", p] as const,
  one: (id: string) => ["jobs", "one", id] as const,
};

function listUrl(p: JobListParams) {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(p)) if (v !== undefined && v !== "") q.set(k, String(v));
  return `/api/v1/jobs?${q}`;
}

/** A page of the jobs list; the previous page stays on screen while the next loads. */
export function useJobs(p: JobListParams, opts: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: jobKeys.list(p), queryFn: () => apiFetch<JobPage>(listUrl(p)), placeholderData: keepPreviousData, enabled: opts.enabled });
}

export function useJob(id: string) {
  return useQuery({ queryKey: jobKeys.one(id), queryFn: () => apiFetch<{ job: Job; circuits: CircuitSummary[] }>(`/api/v1/jobs/${id}`) });
}

export function useCreateJob() {
  const qc = useQueryClient();
  return useMutation<{ job: Job }, ApiClientError, CreateJobInput>({
    mutationFn: (json) => apiFetch("/api/v1/jobs", { method: "POST", json }),
    onSuccess: () => qc.invalidateQueries({ queryKey: jobKeys.all }),
  });
}

/**
 * Changes a job's fields (a rename, a status) at once on screen, and puts the old values back if the server
 * refuses.
 */
export function useUpdateJob(id: string) {
  const qc = useQueryClient();
  type Snapshot = { job: Job; circuits: CircuitSummary[] } | undefined;
  return useMutation<{ job: Job }, ApiClientError, UpdateJobInput, { before: Snapshot }>({
    mutationFn: (json) => apiFetch(`/api/v1/jobs/${id}`, { method: "PATCH", json }),
    onMutate: async (changes) => {
      await qc.cancelQueries({ queryKey: jobKeys.one(id) });
      const before = qc.getQueryData<Snapshot>(jobKeys.one(id));
      if (before) qc.setQueryData(jobKeys.one(id), { ...before, job: { ...before.job, ...changes } });
      return { before };
    },
    onError: (_e, _v, ctx) => {
      if (ctx?.before) qc.setQueryData(jobKeys.one(id), ctx.before);
    },
    onSettled: () => qc.invalidateQueries({ queryKey: jobKeys.all }),
  });
}

export function useDeleteJob(id: string) {
  const qc = useQueryClient();
  return useMutation<void, ApiClientError, void>({
    mutationFn: () => apiFetch(`/api/v1/jobs/${id}`, { method: "DELETE" }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: jobKeys.one(id) });
      return qc.invalidateQueries({ queryKey: jobKeys.all });
    },
  });
}

export type SavedSizing = {
  id: string;
  jobId: string;
  title: string;
  inputs: Record<string, string>;
  request: SizingRequest;
  answer: SizingSummary;
  createdAt: string;
  createdByName: string | null;
};

export const sizingKeys = { job: (jobId: string) => ["jobs", "sizings", jobId] as const };

export function useSizings(jobId: string) {
  return useQuery({ queryKey: sizingKeys.job(jobId), queryFn: () => apiFetch<{ sizings: SavedSizing[] }>(`/api/v1/jobs/${jobId}/sizings`) });
}

export function useSaveSizing() {
  const qc = useQueryClient();
  return useMutation<{ sizing: SavedSizing }, ApiClientError, { jobId: string; body: SaveSizingBody }>({
    mutationFn: ({ jobId, body }) => apiFetch(`/api/v1/jobs/${jobId}/sizings`, { method: "POST", json: body }),
    onSuccess: (_d, v) => qc.invalidateQueries({ queryKey: sizingKeys.job(v.jobId) }),
  });
}

export function useDeleteSizing(jobId: string) {
  const qc = useQueryClient();
  return useMutation<void, ApiClientError, string>({
    mutationFn: (id) => apiFetch(`/api/v1/sizings/${id}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: sizingKeys.job(jobId) }),
  });
}
