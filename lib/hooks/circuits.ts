"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CircuitDocument } from "@/lib/circuit";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import type { CreateReadingInput } from "@/lib/validators/work";
import { jobKeys } from "./jobs";

export type Circuit = {
  id: string;
  jobId: string;
  jobTitle: string;
  name: string;
  version: number;
  document: CircuitDocument;
  createdAt: string;
  updatedAt: string;
  updatedByName: string | null;
};
export type Revision = { version: number; name: string; message: string | null; createdAt: string; createdByName: string | null; components: number; wires: number };
export type Reading = {
  id: string;
  circuitId: string;
  stateId: string;
  positive: string;
  negative: string;
  value: number;
  unit: "V" | "mV";
  currentA: number | null;
  note: string;
  takenAt: string;
  takenById: string | null;
  takenByName: string | null;
  updatedAt: string;
};
/** What a 412 carries: the version saved meanwhile. */
export type StaleVersion = { version: number; document: CircuitDocument; name: string; updatedAt: string; updatedByName: string | null };

export const circuitKeys = {
  one: (id: string) => ["circuit", id] as const,
  revisions: (id: string) => ["circuit", id, "revisions"] as const,
  revision: (id: string, v: number) => ["circuit", id, "revisions", v] as const,
  readings: (id: string) => ["circuit", id, "readings"] as const,
};

export function useCircuit(id: string) {
  return useQuery({ queryKey: circuitKeys.one(id), queryFn: () => apiFetch<{ circuit: Circuit; canEdit: boolean }>(`/api/v1/circuits/${id}`) });
}

/** The stale version from a 412 answer, or undefined for any other error. */
export function staleVersionOf(error: ApiClientError | null): StaleVersion | undefined {
  return error?.status === 412 ? (error.body as { current?: StaleVersion } | undefined)?.current : undefined;
}

/** Saves a document over the version it was edited from (If-Match); a 412 comes back as an error with the newer version. */
export function useSaveCircuit(id: string) {
  const qc = useQueryClient();
  return useMutation<{ version: number }, ApiClientError, { document: CircuitDocument; baseVersion: number; message?: string }>({
    mutationFn: ({ document, baseVersion, message }) =>
      apiFetch(`/api/v1/circuits/${id}`, { method: "PUT", json: { document, ...(message ? { message } : {}) }, headers: { "if-match": `"${baseVersion}"` } }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: circuitKeys.one(id) }), qc.invalidateQueries({ queryKey: jobKeys.all })]),
  });
}

export function useDeleteCircuit(id: string, jobId: string) {
  const qc = useQueryClient();
  return useMutation<void, ApiClientError, void>({
    mutationFn: () => apiFetch(`/api/v1/circuits/${id}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: jobKeys.one(jobId) }),
  });
}

export function useCreateCircuit(jobId: string) {
  const qc = useQueryClient();
  return useMutation<{ circuit: Circuit }, ApiClientError, { name?: string; document?: unknown }>({
    mutationFn: (json) => apiFetch(`/api/v1/jobs/${jobId}/circuits`, { method: "POST", json }),
    onSuccess: () => qc.invalidateQueries({ queryKey: jobKeys.all }),
  });
}

export function useImportCircuit(jobId: string) {
  const qc = useQueryClient();
  return useMutation<{ circuit: Circuit; readings: number }, ApiClientError, unknown>({
    mutationFn: (json) => apiFetch(`/api/v1/jobs/${jobId}/import`, { method: "POST", json }),
    onSuccess: () => qc.invalidateQueries({ queryKey: jobKeys.all }),
  });
}

export function useRevisions(id: string) {
  return useQuery({ queryKey: circuitKeys.revisions(id), queryFn: () => apiFetch<{ revisions: Revision[] }>(`/api/v1/circuits/${id}/revisions`).then((r) => r.revisions) });
}

export function useRevision(id: string, version: number | undefined) {
  return useQuery({
    queryKey: circuitKeys.revision(id, version ?? 0),
    queryFn: () => apiFetch<{ revision: Revision & { document: CircuitDocument } }>(`/api/v1/circuits/${id}/revisions/${version}`).then((r) => r.revision),
    enabled: version !== undefined,
    staleTime: Infinity, // a saved version never changes
  });
}

export function useRestore(id: string) {
  const qc = useQueryClient();
  return useMutation<{ version: number }, ApiClientError, { version: number }>({
    mutationFn: (json) => apiFetch(`/api/v1/circuits/${id}/restore`, { method: "POST", json }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: circuitKeys.one(id) }), qc.invalidateQueries({ queryKey: circuitKeys.revisions(id) })]),
  });
}

export function useReadings(id: string, enabled = true) {
  return useQuery({ queryKey: circuitKeys.readings(id), queryFn: () => apiFetch<{ readings: Reading[] }>(`/api/v1/circuits/${id}/readings`).then((r) => r.readings), enabled });
}

export function useCreateReading(id: string) {
  const qc = useQueryClient();
  return useMutation<{ reading: Reading }, ApiClientError, CreateReadingInput>({
    mutationFn: (json) => apiFetch(`/api/v1/circuits/${id}/readings`, { method: "POST", json }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: circuitKeys.readings(id) }), qc.invalidateQueries({ queryKey: jobKeys.all })]),
  });
}

export function useDeleteReading(circuitId: string) {
  const qc = useQueryClient();
  return useMutation<void, ApiClientError, string, { before?: Reading[] }>({
    mutationFn: (readingId) => apiFetch(`/api/v1/readings/${readingId}`, { method: "DELETE" }),
    onMutate: async (readingId) => {
      await qc.cancelQueries({ queryKey: circuitKeys.readings(circuitId) });
      const before = qc.getQueryData<Reading[]>(circuitKeys.readings(circuitId));
      if (before) qc.setQueryData(circuitKeys.readings(circuitId), before.filter((r) => r.id !== readingId));
      return { before };
    },
    onError: (_e, _v, ctx) => {
      if (ctx?.before) qc.setQueryData(circuitKeys.readings(circuitId), ctx.before);
    },
    onSettled: () => qc.invalidateQueries({ queryKey: circuitKeys.readings(circuitId) }),
  });
}
