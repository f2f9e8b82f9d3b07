/**
 * The load half of `npm run bench:api` (scripts/bench-api.sh starts the server): GET of a 300-component circuit at
 * 10 connections, then PUTs that each carry the version their circuit is at. Prints requests per second,
 * p50/p95/p99 latency and errors. Not a test.
 */
import autocannon from "autocannon";
import { harnessCircuit } from "../tests/support/harness";

const base = process.env.APP_URL ?? "http://127.0.0.1:3200";
const seconds = Number(process.env.BENCH_SECONDS ?? 15);
const connections = 10;

async function api(path: string, init: RequestInit & { cookie?: string } = {}) {
  const res = await fetch(`${base}${path}`, {
    ...init,
    headers: { origin: base, "content-type": "application/json", ...(init.cookie ? { cookie: init.cookie } : {}), ...init.headers },
  });
  if (!res.ok) throw new Error(`${init.method ?? "GET"} ${path} answered ${res.status}: ${await res.text()}`);
  return res;
}

function percentile(sorted: number[], p: number) {
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN;
}

async function run(name: string, opts: autocannon.Options) {
  const times: number[] = [];
  const statuses = new Map<number, number>();
  // Called without a callback it is a promise that is also an event emitter (its typings only say the former).
  const instance = autocannon({ ...opts, connections, duration: seconds }) as unknown as Promise<autocannon.Result> & NodeJS.EventEmitter;
  instance.on("response", (_client: unknown, status: number, _bytes: number, ms: number) => {
    times.push(ms);
    statuses.set(status, (statuses.get(status) ?? 0) + 1);
  });
  const result = await instance;
  times.sort((a, b) => a - b);
  const codes = [...statuses].map(([s, n]) => `${s}: ${n}`).join(", ");
  console.log(
    `${name.padEnd(34)} ${String(Math.round(result.requests.average)).padStart(6)} req/s   p50 ${percentile(times, 50).toFixed(1)} ms   p95 ${percentile(times, 95).toFixed(1)} ms   p99 ${percentile(times, 99).toFixed(1)} ms   errors ${result.errors + result.timeouts}   (${codes})`,
  );
}

async function main() {
  const signIn = await api("/api/auth/sign-in/email", { method: "POST", body: JSON.stringify({ email: "tobias@larkspur.example", password: "larkspur-demo-2026" }) });
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  const doc = { ...harnessCircuit(300), name: "Bench harness" };
  const job = await (await api("/api/v1/jobs", { method: "POST", cookie, body: JSON.stringify({ organizationId: "org_demo_shop", title: "API bench" }) })).json();
  const make = async () => (await (await api(`/api/v1/jobs/${job.job.id}/circuits`, { method: "POST", cookie, body: JSON.stringify({ document: doc }) })).json()).circuit.id as string;
  const readId = await make();
  const pool: { id: string; version: number }[] = [];
  for (let i = 0; i < 2 * connections; i++) pool.push({ id: await make(), version: 1 });
  const body = JSON.stringify({ document: doc });

  console.log(`Circuits API on ${base}: ${doc.components.length} components, ${doc.wires.length} wires, ${Math.round(body.length / 1024)} KB a document; ${connections} connections, ${seconds} s each`);
  await run("GET /api/v1/circuits/:id", { url: `${base}/api/v1/circuits/${readId}`, headers: { cookie } });
  await run("PUT /api/v1/circuits/:id (If-Match)", {
    url: base,
    requests: [
      {
        method: "PUT",
        setupRequest: (req: autocannon.Request, context: object) => {
          // Each request takes a circuit no other connection is saving, at the version it is at.
          const c = pool.pop()!;
          (context as { circuit?: typeof c }).circuit = c;
          return { ...req, path: `/api/v1/circuits/${c.id}`, headers: { cookie, "content-type": "application/json", "if-match": `"${c.version}"` }, body };
        },
        onResponse: (_status: number, _body: string, context: object, headers?: Record<string, string | string[] | undefined>) => {
          const c = (context as { circuit: { id: string; version: number } }).circuit;
          const tag = headers?.etag;
          if (tag) c.version = Number(String(tag).replace(/"/g, ""));
          pool.push(c);
        },
      },
    ],
  });
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
