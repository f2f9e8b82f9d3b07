import type { Pool } from "pg";
import { auth } from "@/lib/auth/server";

const base = () => process.env.APP_URL ?? "http://127.0.0.1:3100";

let caller = 0;

/**
 * Signs a user in through better-auth's handler and returns the Cookie header for later requests. Each sign-in
 * comes from an address of its own (a documentation range, RFC 5737), so the suite's many sign-ins of the same demo
 * person never meet the abuse limit of five a minute per address and account, which its own test exercises.
 */
export async function signInCookie(email: string, password: string): Promise<string> {
  caller += 1;
  const address = `198.51.${(process.pid >> 8) % 256}.${(caller + process.pid) % 256}`;
  const res = await auth.handler(
    new Request(new URL("/api/auth/sign-in/email", base()), {
      method: "POST",
      headers: { origin: base(), "content-type": "application/json", "x-ampwright-peer": address },
      body: JSON.stringify({ email, password }),
    }),
  );
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler as the browser would, with an optional session cookie and JSON body. */
export function callRoute(handler: Handler, opts: { method?: string; path?: string; params?: Record<string, string>; cookie?: string; json?: unknown } = {}) {
  const req = new Request(new URL(opts.path ?? "/api/v1/x", base()), {
    method: opts.method ?? (opts.json !== undefined ? "POST" : "GET"),
    headers: { origin: base(), "content-type": "application/json", ...(opts.cookie ? { cookie: opts.cookie } : {}) },
    body: opts.json !== undefined ? JSON.stringify(opts.json) : undefined,
  });
  return handler(req, { params: Promise.resolve(opts.params ?? {}) });
}

/** Leaves the demo as it was for the browser tests that follow: only the demo's own jobs stay. */
export async function removeTestJobs(pool: Pool) {
  await pool.query("delete from jobs where id not like 'job_demo_%'");
}
