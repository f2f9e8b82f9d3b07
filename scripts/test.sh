#!/usr/bin/env bash
# npm test: its own throwaway services and ports, then typecheck, lint, unit, integration, build, browser tests.
# Prints "N passed, N failed" alone on the last line and exits non-zero on any failure.
set -uo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
cd "$ROOT"

# Test-only ports and folders: never the demo cluster, the served build, or npm start's ports.
export AMP_PG_NAME=pg-test AMP_PG_PORT=54339 AMP_PG_DB=ampwright_test AMP_PG_FAST=1
export DATABASE_URL="postgres://ampwright@127.0.0.1:54339/ampwright_test"
export TEST_PORT="${TEST_PORT:-3100}"
export APP_URL="http://127.0.0.1:$TEST_PORT"
export E2E_BASE_URL="$APP_URL"
export NEXT_DIST_DIR=.next-test
export AMP_SMTP_PORT=2526 AMP_MAIL_WEB_PORT=2581
export SMTP_URL="smtp://127.0.0.1:$AMP_SMTP_PORT"
export MAILDEV_API="http://127.0.0.1:$AMP_MAIL_WEB_PORT"
export AMP_S3_PORT="${AMP_S3_PORT:-4579}" S3_BUCKET=ampwright-test
export S3_ENDPOINT="http://127.0.0.1:$AMP_S3_PORT"
S3_DIR="$ROOT/.data/s3-test"
export BETTER_AUTH_SECRET="test-secret-$(date +%s)-0123456789abcdefghijklmnop"
REPORTS="$ROOT/test-artifacts/reports"
START=$(date +%s)

set -e
command -v curl >/dev/null || apt_install curl
ensure_node_modules
[ -x /usr/bin/chromium ] || { say "installing Debian's chromium for the browser tests"; apt_install chromium; }
command -v ngspice >/dev/null || { say "installing Debian's ngspice (the solver's independent oracle)"; apt_install ngspice; }
command -v pdftotext >/dev/null || { say "installing Debian's poppler-utils (the report tests read PDFs with it)"; apt_install poppler-utils; }
set +e

SERVER_PID=""
MAILDEV_PID=""
S3RVER_PID=""
cleanup() {
  trap - INT TERM EXIT
  stop_group "$SERVER_PID"
  stop_group "$MAILDEV_PID"
  stop_group "$S3RVER_PID"
  rm -rf "$S3_DIR" "$S3_DIR.cors.xml"
  # The outbox test restarts the catcher, so also stop whatever listens on its port now.
  pkill -f "maildev --smtp $AMP_SMTP_PORT " 2>/dev/null || true
  bash scripts/db.sh destroy >/dev/null 2>&1 || true
}
trap cleanup INT TERM EXIT

rm -rf "$REPORTS"; mkdir -p "$REPORTS"
# Throwaway data: a fresh cluster each run.
bash scripts/db.sh destroy >/dev/null 2>&1 || true
bash scripts/db.sh start || { echo "0 passed, 1 failed"; exit 1; }
start_maildev "$AMP_SMTP_PORT" "$AMP_MAIL_WEB_PORT" "$REPORTS/maildev.log" || { echo "0 passed, 1 failed"; exit 1; }
rm -rf "$S3_DIR"
start_s3rver "$AMP_S3_PORT" "$S3_DIR" "$S3_BUCKET" "$APP_URL" "$REPORTS/s3rver.log" || { echo "0 passed, 1 failed"; exit 1; }

check() { # name, command...: a step that is one check in the count
  local name="$1"; shift
  say "$name"
  if "$@" >"$REPORTS/$name.log" 2>&1; then echo pass >"$REPORTS/$name.check"
  else echo fail >"$REPORTS/$name.check"; tail -n 60 "$REPORTS/$name.log" >&2; fi
}

check typecheck node_modules/.bin/tsc --noEmit
check lint node_modules/.bin/eslint . --max-warnings=0

say "unit and integration tests"
node_modules/.bin/vitest run --project unit --project integration \
  --reporter=default --reporter=json --outputFile.json="$REPORTS/vitest.json" 2>&1 | tail -n 40

check build node_modules/.bin/next build
if [ "$(cat "$REPORTS/build.check")" = pass ]; then
  if port_busy "$TEST_PORT"; then
    say "port $TEST_PORT is in use; set TEST_PORT to a free port"; echo fail >"$REPORTS/server.check"
  else
    setsid node scripts/serve.mjs -H 127.0.0.1 -p "$TEST_PORT" >"$REPORTS/server.log" 2>&1 &
    SERVER_PID=$!
    if wait_for_http "$APP_URL/api/health" "$SERVER_PID"; then
      echo pass >"$REPORTS/server.check"
      say "browser tests (Chromium)"
      node_modules/.bin/vitest run --project e2e \
        --reporter=default --reporter=json --outputFile.json="$REPORTS/e2e.json" 2>&1 | tail -n 40
    else
      echo fail >"$REPORTS/server.check"; tail -n 40 "$REPORTS/server.log" >&2
    fi
  fi
fi

say "finished in $(( $(date +%s) - START )) s; screenshots in test-artifacts/"
node scripts/summarise-tests.mjs "$REPORTS" vitest.json e2e.json
