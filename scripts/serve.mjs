// Serves the production build (what `next start` does), and records each request's socket address in a header of
// our own that a client cannot set: lib/net/client-address.ts reads it, with TRUSTED_PROXIES, to find the caller.
// Usage: node scripts/serve.mjs [-p PORT] [-H HOST]
import { createServer } from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";
import next from "next";

const args = process.argv.slice(2);
const arg = (flag, fallback) => {
  const i = args.indexOf(flag);
  return i >= 0 && args[i + 1] ? args[i + 1] : fallback;
};
const port = Number(arg("-p", process.env.PORT ?? "3000"));
const hostname = arg("-H", "127.0.0.1");
const dir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

export const PEER_HEADER = "x-ampwright-peer";
// The app believes the header only when this server put it there.
process.env.AMPWRIGHT_PEER_HEADER = "1";
process.env.NODE_ENV = "production";

const app = next({ dev: false, dir, hostname, port });
const handle = app.getRequestHandler();
await app.prepare();

/** An address whose path is not valid percent-encoded UTF-8 (a lone surrogate, a stray %FF): Next.js would answer 500. */
function badPath(url) {
  try {
    decodeURIComponent((url ?? "/").split("?")[0]);
    return false;
  } catch {
    return true;
  }
}

const server = createServer((req, res) => {
  // Whatever the client sent under this name is replaced by the address of the socket it really came from.
  req.headers[PEER_HEADER] = req.socket.remoteAddress ?? "";
  if (badPath(req.url)) {
    const body = JSON.stringify({ error: { code: "bad-text", message: "The address has characters that are not valid text (broken percent-encoding). Check the link." } });
    res.writeHead(400, { "content-type": "application/json", "content-length": Buffer.byteLength(body), "x-content-type-options": "nosniff", "cache-control": "no-store" });
    res.end(body);
    return;
  }
  handle(req, res);
});
server.keepAliveTimeout = 65_000;
server.listen(port, hostname, () => {
  console.log(`Ampwright serving on http://${hostname}:${port}`);
});
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => server.close(() => process.exit(0)));
