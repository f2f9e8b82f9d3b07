#!/usr/bin/env bash
# npm run bench:api (and bench:ui): the circuits API under load (autocannon), or the pages in headless Chromium
# (scripts/bench-ui.ts, given as the first argument), against a production build on loopback with its own
# throwaway PostgreSQL. Prints figures; it is not a test.
set -uo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
cd "$ROOT"

export AMP_PG_NAME=pg-bench AMP_PG_PORT="${BENCH_PG_PORT:-54359}" AMP_PG_DB=ampwright_bench AMP_PG_FAST=1
export DATABASE_URL="postgres://ampwright@127.0.0.1:$AMP_PG_PORT/ampwright_bench"
export BENCH_PORT="${BENCH_PORT:-3200}"
export APP_URL="http://127.0.0.1:$BENCH_PORT"
export NEXT_DIST_DIR=.next-bench NODE_ENV=production DEMO=1 NEXT_TELEMETRY_DISABLED=1
export SMTP_URL="smtp://127.0.0.1:9" # nothing is mailed during the bench
export BETTER_AUTH_SECRET="bench-secret-$(date +%s)-0123456789abcdefghijklmnop"

set -e
ensure_node_modules
SERVER_PID=""
cleanup() {
  trap - INT TERM EXIT
  stop_group "$SERVER_PID"
  bash scripts/db.sh destroy >/dev/null 2>&1 || true
}
trap cleanup INT TERM EXIT
bash scripts/db.sh destroy >/dev/null 2>&1 || true
bash scripts/db.sh start
node_modules/.bin/tsx db/migrate.ts
node_modules/.bin/tsx db/seed.ts
say "building into $NEXT_DIST_DIR (about a minute)"
node_modules/.bin/next build >/tmp/ampwright-bench-build.log 2>&1 || { tail -n 30 /tmp/ampwright-bench-build.log; exit 1; }
port_busy "$BENCH_PORT" && { say "port $BENCH_PORT is in use; set BENCH_PORT"; exit 1; }
setsid node scripts/serve.mjs -H 127.0.0.1 -p "$BENCH_PORT" >/tmp/ampwright-bench-server.log 2>&1 &
SERVER_PID=$!
wait_for_http "$APP_URL/api/health" "$SERVER_PID"
set +e
node_modules/.bin/tsx "${1:-scripts/bench-api.ts}"
