"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import type { CreateShareLinkInput, EmailReportInput } from "@/lib/validators/sharing";

export type ShareLink = {
  id: string;
  jobId: string;
  circuitId: string | null;
  circuitName: string | null;
  label: string;
  expiresAt: string | null;
  revokedAt: string | null;
  openCount: number;
  lastOpenedAt: string | null;
  createdAt: string;
  createdByName: string | null;
  /** Only in the answer that made the link: the one time its address is shown. */
  url?: string;
};

export const shareKeys = { job: (jobId: string) => ["jobs", "share-links", jobId] as const };

export function useShareLinks(jobId: string) {
  return useQuery({ queryKey: shareKeys.job(jobId), queryFn: () => apiFetch<{ links: ShareLink[] }>(`/api/v1/jobs/${jobId}/share-links`) });
}

export function useCreateShareLink(jobId: string) {
  const qc = useQueryClient();
  return useMutation<{ link: ShareLink }, ApiClientError, CreateShareLinkInput>({
    mutationFn: (json) => apiFetch(`/api/v1/jobs/${jobId}/share-links`, { method: "POST", json }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.job(jobId) }),
  });
}

export function useRevokeShareLink(jobId: string) {
  const qc = useQueryClient();
  return useMutation<{ link: ShareLink }, ApiClientError, string>({
    mutationFn: (id) => apiFetch(`/api/v1/share-links/${id}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.job(jobId) }),
  });
}

export function useEmailReport(jobId: string) {
  const qc = useQueryClient();
  return useMutation<{ queued: boolean; to: string; linkId: string | null }, ApiClientError, EmailReportInput>({
    mutationFn: (json) => apiFetch(`/api/v1/jobs/${jobId}/report/email`, { method: "POST", json }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.job(jobId) }),
  });
}
