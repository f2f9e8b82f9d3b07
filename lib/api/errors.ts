import type { z } from "zod";

export type ApiIssue = { path: string; message: string; code?: string };
export type ApiErrorBody = { error: { code: string; message: string; issues?: ApiIssue[] } };

/** An expected failure with its HTTP status; the route wrapper turns it into the one error shape. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: ApiIssue[],
  ) {
    super(message);
  }
}

/** zod issues as "field.path: message" rows a person can act on. */
export function zodIssues(error: z.ZodError): ApiIssue[] {
  return error.issues.map((i) => ({
    path: i.path.map(String).join(".") || "(body)",
    message: i.message,
    code: i.code,
  }));
}

export function errorResponse(status: number, code: string, message: string, issues?: ApiIssue[]): Response {
  const body: ApiErrorBody = { error: { code, message, ...(issues ? { issues } : {}) } };
  return Response.json(body, { status, headers: { "cache-control": "no-store" } });
}
