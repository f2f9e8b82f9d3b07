import "server-only";
import type { z } from "zod";
import { env } from "@/lib/env";
import { API_CSP } from "@/lib/net/security-headers";
import { badTextReason, findBadText } from "@/lib/validators/text";
import { ApiError, errorResponse, zodIssues } from "./errors";

type Ctx<TBody> = { req: Request; body: TBody; params: Record<string, string> };

type Options<S extends z.ZodType | undefined> = {
  /** The zod schema the JSON body must satisfy. */
  body?: S;
  /** Largest body accepted, bytes (default 1 MB). */
  maxBytes?: number;
  /**
   * "compute" for a POST that changes nothing and reads no session (solve, cable size): it may come from anywhere.
   * Every other write must come from Ampwright's own pages.
   */
  crossSite?: "refuse" | "compute";
};

const WRITES = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * A write from a browser must come from the app's own origin: the Origin header when the browser sends one, else
 * Sec-Fetch-Site. A request with neither did not come from a browser page, and so is refused too (no cookie-borne
 * write can be forged without them).
 */
export function assertSameOrigin(req: Request): void {
  const appOrigin = new URL(env().APP_URL).origin;
  const origin = req.headers.get("origin");
  if (origin !== null) {
    if (origin !== appOrigin) throw new ApiError(403, "cross-site", "This change did not come from Ampwright's own pages, so it was refused.");
    return;
  }
  const site = req.headers.get("sec-fetch-site");
  if (site === "same-origin" || site === "none") return;
  throw new ApiError(403, "cross-site", "This change did not say where it came from (no Origin header), so it was refused. Send it from Ampwright's pages.");
}

/** JSON bodies must say so: a form or text/plain post from another site cannot pass as JSON. */
function assertJson(req: Request): void {
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/json") {
    throw new ApiError(415, "unsupported-media-type", `Send the body as JSON with "Content-Type: application/json"${type ? ` (this one said ${type.slice(0, 60)})` : ""}.`);
  }
}

/** Path ids and query values with NUL or broken characters are refused before anything reads them. */
function assertCleanUrl(req: Request, params: Record<string, string>): void {
  for (const [name, value] of Object.entries(params)) {
    const reason = typeof value === "string" ? badTextReason(value) : undefined;
    if (reason) throw new ApiError(400, "bad-text", `The address's ${name} ${reason}.`, [{ path: name, message: reason }]);
  }
  for (const [name, value] of new URL(req.url).searchParams) {
    const reason = badTextReason(name) ?? badTextReason(value);
    if (reason) throw new ApiError(400, "bad-text", `The query parameter ${badTextReason(name) ? "name" : name} ${reason}.`, [{ path: badTextReason(name) ? "(query)" : name, message: reason }]);
  }
}

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
      if (WRITES.has(req.method) && options.crossSite !== "compute") assertSameOrigin(req);
      assertCleanUrl(req, params);
      let body: unknown = undefined;
      if (options.body) {
        assertJson(req);
        const text = await readBody(req, options.maxBytes ?? 1_000_000);
        let json: unknown;
        try {
          json = JSON.parse(text);
        } catch {
          throw new ApiError(400, "invalid-json", "The request body is not valid JSON.");
        }
        const bad = findBadText(json);
        if (bad) throw new ApiError(400, "bad-text", `The field ${bad.path} ${bad.reason}. Remove it and send again.`, [{ path: bad.path, message: bad.reason }]);
        const parsed = options.body.safeParse(json);
        if (!parsed.success) {
          throw new ApiError(422, "invalid-request", "Some fields need fixing; see issues.", zodIssues(parsed.error));
        }
        body = parsed.data;
      }
      return withApiCsp(await handler({ req, body: body as never, params }));
    } catch (err) {
      if (err instanceof ApiError) return withApiCsp(errorResponse(err.status, err.code, err.message, err.issues));
      console.error("unhandled error in", req.method, new URL(req.url).pathname, err);
      return withApiCsp(errorResponse(500, "internal", "Something went wrong on the server. Nothing was changed; try again."));
    }
  };
}

/** API answers other than PDFs get a policy that lets nothing in them run (a route may set its own). */
function withApiCsp(res: Response): Response {
  const type = res.headers.get("content-type") ?? "";
  if (!res.headers.has("content-security-policy") && !type.startsWith("application/pdf")) {
    try {
      res.headers.set("content-security-policy", API_CSP);
    } catch {
      // a response whose headers cannot change (a fetched one passed through) keeps its own
    }
  }
  return res;
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
