# Shared by start.sh and test.sh: install what is missing, the same way on a fresh machine and on a used one.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1
export VITE_CONFIG_NATIVE_IGNORE_WARNING=true

say() { echo "[ampwright] $*" >&2; }

apt_install() {
  if [ "$(id -u)" -ne 0 ]; then
    say "missing Debian packages: $*; install them with: sudo apt-get install -y $*"; return 1
  fi
  export DEBIAN_FRONTEND=noninteractive
  if [ -z "${AMP_APT_UPDATED:-}" ]; then apt-get update -qq >/dev/null; AMP_APT_UPDATED=1; fi
  apt-get install -y -qq "$@" >/dev/null
}

ensure_node_modules() {
  local stamp="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$stamp" ] || [ "$ROOT/package-lock.json" -nt "$stamp" ]; then
    say "installing npm dependencies (npm ci)"
    # --include=dev: npm start runs with NODE_ENV=production, under which npm ci would leave out the build's tools
    # (Tailwind's PostCSS plugin, TypeScript); the build needs them.
    (cd "$ROOT" && npm ci --include=dev --no-audit --no-fund --loglevel=error)
  fi
}

# Waits until a URL answers 200, or the process it belongs to dies.
wait_for_http() {
  local url="$1" pid="$2" tries="${3:-120}"
  for _ in $(seq "$tries"); do
    if curl -fsS -o /dev/null "$url" 2>/dev/null; then return 0; fi
    kill -0 "$pid" 2>/dev/null || return 1
    sleep 0.5
  done
  return 1
}

port_busy() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# Stops a process group started with setsid, politely first.
stop_group() {
  local pid="$1"
  [ -n "$pid" ] || return 0
  kill -TERM -- "-$pid" 2>/dev/null || return 0
  for _ in $(seq 50); do kill -0 "$pid" 2>/dev/null || return 0; sleep 0.1; done
  kill -KILL -- "-$pid" 2>/dev/null || true
}

# The local mail catcher (maildev): SMTP and its web inbox + REST API, both on loopback.
start_maildev() {
  local smtp="$1" web="$2" log="$3"
  if port_busy "$smtp" || port_busy "$web"; then
    say "mail catcher ports $smtp/$web are in use; set AMP_SMTP_PORT / AMP_MAIL_WEB_PORT"; return 1
  fi
  setsid "$ROOT/node_modules/.bin/maildev" --smtp "$smtp" --ip 127.0.0.1 --web "$web" --web-ip 127.0.0.1 >"$log" 2>&1 &
  MAILDEV_PID=$!
  for _ in $(seq 60); do port_busy "$smtp" && port_busy "$web" && return 0; sleep 0.25; done
  say "the mail catcher did not start; see $log"; return 1
}

# The local S3 stand-in (s3rver) on loopback, with the bucket made at start and CORS open to the app's origin only,
# so the browser can PUT to presigned URLs. Sets S3RVER_PID.
start_s3rver() {
  local port="$1" dir="$2" bucket="$3" origin="$4" log="$5"
  if port_busy "$port"; then
    say "object store port $port is in use; set AMP_S3_PORT"; return 1
  fi
  mkdir -p "$dir"
  cat >"$dir.cors.xml" <<XML
<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>$origin</AllowedOrigin>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>600</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>
XML
  setsid "$ROOT/node_modules/.bin/s3rver" -d "$dir" -a 127.0.0.1 -p "$port" --silent --no-vhost-buckets --configure-bucket "$bucket" "$dir.cors.xml" >"$log" 2>&1 &
  S3RVER_PID=$!
  for _ in $(seq 80); do port_busy "$port" && return 0; sleep 0.25; done
  say "the object store did not start; see $log"; return 1
}

# A secret for signing sessions, made once per clone for local runs (production sets BETTER_AUTH_SECRET itself).
local_secret() {
  local f="$ROOT/.data/auth-secret"
  mkdir -p "$ROOT/.data"
  [ -s "$f" ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))' >"$f"
  cat "$f"
}
