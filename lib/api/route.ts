import "server-only";
import type { z } from "zod";
import { ApiError, errorResponse, zodIssues } from "./errors";

type Ctx<TBody> = { req: Request; body: TBody; params: Record<string, string> };

type Options<S extends z.ZodType | undefined> = {
  /** The zod schema the JSON body must satisfy. */
  body?: S;
  /** Largest body accepted, bytes (default 1 MB). */
  maxBytes?: number;
};

/**
 * One wrapper for every route handler: reads and size-checks the body, parses it with the route's zod schema, and
 * turns every thrown error into `{ error: { code, message, issues } }`. Unknown errors are logged and answered
 * with a generic 500; raw exception text never reaches the client.
 */
export function route<S extends z.ZodType | undefined = undefined>(
  options: Options<S>,
  handler: (ctx: Ctx<S extends z.ZodType ? z.infer<S> : undefined>) => Promise<Response> | Response,
) {
  return async (req: Request, context?: { params?: Promise<Record<string, string>> }): Promise<Response> => {
    try {
      const params = (await context?.params) ?? {};
      let body: unknown = undefined;
      if (options.body) {
        const text = await readBody(req, options.maxBytes ?? 1_000_000);
        let json: unknown;
        try {
          json = JSON.parse(text);
        } catch {
          throw new ApiError(400, "invalid-json", "The request body is not valid JSON.");
        }
        const parsed = options.body.safeParse(json);
        if (!parsed.success) {
          throw new ApiError(422, "invalid-request", "Some fields need fixing; see issues.", zodIssues(parsed.error));
        }
        body = parsed.data;
      }
      return await handler({ req, body: body as never, params });
    } catch (err) {
      if (err instanceof ApiError) return errorResponse(err.status, err.code, err.message, err.issues);
      console.error("unhandled error in", req.method, new URL(req.url).pathname, err);
      return errorResponse(500, "internal", "Something went wrong on the server. Nothing was changed; try again.");
    }
  };
}

/** The URL's query string parsed with a zod schema; 422 with the failing parameters otherwise. */
export function parseQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const params = Object.fromEntries(new URL(req.url).searchParams);
  const parsed = schema.safeParse(params);
  if (!parsed.success) throw new ApiError(422, "invalid-query", "Some query parameters need fixing; see issues.", zodIssues(parsed.error));
  return parsed.data;
}

async function readBody(req: Request, maxBytes: number): Promise<string> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  const tooLarge = () =>
    new ApiError(413, "too-large", `The request body is larger than ${Math.round(maxBytes / 1e6)} MB. Send a smaller document.`);
  if (declared > maxBytes) throw tooLarge();
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}
