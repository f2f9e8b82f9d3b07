import { QueryClient } from "@tanstack/react-query";
import type { ApiErrorBody, ApiIssue } from "@/lib/api/errors";

/** One factory for every QueryClient (one per browser tab). */
export function makeQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: { queries: { staleTime: 30_000, retry: 1 }, mutations: { retry: 0 } } });
}

/** A non-2xx answer, with the API's error shape parsed. */
export class ApiClientError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: ApiIssue[] = [],
    /** The whole answer, for errors that carry more than the error shape (a 412 carries the current version). */
    readonly body?: unknown,
  ) {
    super(message);
  }
}

/** fetch for the API: JSON in and out, throws ApiClientError on any non-2xx answer. */
export async function apiFetch<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, ...rest } = init;
  let res: Response;
  try {
    res = await fetch(path, {
      ...rest,
      headers: { ...(json !== undefined ? { "content-type": "application/json" } : {}), ...rest.headers },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
  } catch {
    throw new ApiClientError(0, "network", "Ampwright's server could not be reached. Check the connection and try again.");
  }
  const text = await res.text();
  const body = text ? (JSON.parse(text) as unknown) : undefined;
  if (!res.ok) {
    const e = (body as ApiErrorBody | undefined)?.error;
    throw new ApiClientError(res.status, e?.code ?? "http", e?.message ?? `The server answered ${res.status}.`, e?.issues, body);
  }
  return body as T;
}
