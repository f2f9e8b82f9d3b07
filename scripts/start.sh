#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL, migrate, load the demo, build, serve on 127.0.0.1.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
cd "$ROOT"

PORT="${PORT:-3000}"
export PORT
export AMP_PG_NAME=pg AMP_PG_PORT="${AMP_PG_PORT:-54329}" AMP_PG_DB=ampwright
export DATABASE_URL="${DATABASE_URL:-postgres://ampwright@127.0.0.1:$AMP_PG_PORT/ampwright}"
export APP_URL="${APP_URL:-http://127.0.0.1:$PORT}"
export NODE_ENV=production
export DEMO="${DEMO:-1}"
SMTP_PORT="${AMP_SMTP_PORT:-1025}"
MAIL_WEB_PORT="${AMP_MAIL_WEB_PORT:-1080}"
export SMTP_URL="${SMTP_URL:-smtp://127.0.0.1:$SMTP_PORT}"
S3_PORT="${AMP_S3_PORT:-4569}"
export S3_ENDPOINT="${S3_ENDPOINT:-http://127.0.0.1:$S3_PORT}" S3_BUCKET="${S3_BUCKET:-ampwright}"

if port_busy "$PORT"; then
  say "port $PORT is already in use (another npm start?). Stop it, or run: PORT=3001 npm start"; exit 1
fi

command -v curl >/dev/null || apt_install curl
ensure_node_modules

SERVER_PID=""
MAILDEV_PID=""
S3RVER_PID=""
cleanup() {
  trap - INT TERM EXIT
  say "stopping"
  stop_group "$SERVER_PID"
  stop_group "$MAILDEV_PID"
  stop_group "$S3RVER_PID"
  bash scripts/db.sh stop || true
  say "stopped"
}
trap cleanup INT TERM EXIT

export BETTER_AUTH_SECRET="${BETTER_AUTH_SECRET:-$(local_secret)}"
bash scripts/db.sh start
start_maildev "$SMTP_PORT" "$MAIL_WEB_PORT" "$ROOT/.data/maildev.log"
[ -n "${AMP_EXTERNAL_S3:-}" ] || start_s3rver "$S3_PORT" "$ROOT/.data/s3" "$S3_BUCKET" "$APP_URL" "$ROOT/.data/s3rver.log"
say "applying migrations"
node_modules/.bin/tsx db/migrate.ts
node_modules/.bin/tsx db/seed.ts
say "building (about a minute on two cores)"
NEXT_DIST_DIR=.next node_modules/.bin/next build >"$ROOT/.data/build.log" 2>&1 ||
  { tail -n 40 "$ROOT/.data/build.log" >&2; say "the build failed; the full log is .data/build.log"; exit 1; }

setsid node scripts/serve.mjs -H 127.0.0.1 -p "$PORT" &
SERVER_PID=$!
if ! wait_for_http "http://127.0.0.1:$PORT/api/health" "$SERVER_PID"; then
  say "the server did not come up on port $PORT"; exit 1
fi

cat >&2 <<MSG

  Ampwright is running at http://127.0.0.1:$PORT

  First things to try:
    - Open the start page and read what each area is for.
    - Check http://127.0.0.1:$PORT/api/health: it says whether the database is up.
    - Mail Ampwright sends (sign-up confirmations, password resets) lands in the local inbox at
      http://127.0.0.1:$MAIL_WEB_PORT
    - Photos and PDFs attached to jobs go to a local S3 stand-in (s3rver) at $S3_ENDPOINT, kept in .data/s3.
    - The demo holds an invented shop (Larkspur Road Auto Electric) and class (Fernmoor Technical Institute)
      with their vehicles. Sign in at http://127.0.0.1:$PORT/sign-in as any of these, password larkspur-demo-2026:
        dana@larkspur.example (shop owner)     tobias@larkspur.example (shop lead)
        priya@larkspur.example (technician)    sam@larkspur.example (viewer, service writer)
        lena@fernmoor.example (class owner)    jonah@fernmoor.example (instructor)
        ines@fernmoor.example (student)        theo@fernmoor.example (student)
        ruth@fernmoor.example (observer)
    - As priya: Jobs > "Battery light, Unit 27" > its circuit > Follow a test plan, and enter readings to reach a
      verdict; Jobs > "Battery light at idle" > Report for the printable report, PDF and e-mail; the shared copy is
      at http://127.0.0.1:$PORT/shared/ampwright-demo-unit-14-battery-light-report
    - As lena or ines: Lessons, to open the published bench-trainer lesson and make a copy.

  Press Ctrl-C to stop the server and the database it started.

MSG
wait "$SERVER_PID" || true
