#!/usr/bin/env bash
# Ampwright's private PostgreSQL cluster: Debian's binaries, loopback only, a port and data folder of its own.
#   scripts/db.sh start | stop | status | url
# Settings (environment): AMP_PG_NAME (data folder name, default "pg"), AMP_PG_PORT (default 54329),
# AMP_PG_DB (database, default "ampwright"), AMP_PG_FAST=1 for a throwaway cluster (no fsync).
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
NAME="${AMP_PG_NAME:-pg}"
PORT="${AMP_PG_PORT:-54329}"
DBNAME="${AMP_PG_DB:-ampwright}"
ROLE="ampwright"

log() { echo "[db] $*" >&2; }

find_bindir() {
  local d
  for d in /usr/lib/postgresql/*/bin; do
    [ -x "$d/initdb" ] && { echo "$d"; return 0; }
  done
  return 1
}

ensure_binaries() {
  if ! BIN="$(find_bindir)"; then
    log "PostgreSQL binaries missing: installing Debian's postgresql package"
    if [ "$(id -u)" -ne 0 ]; then
      log "need root to install postgresql (run: sudo apt-get install -y postgresql)"; exit 1
    fi
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >/dev/null
    apt-get install -y -qq postgresql >/dev/null
    # Debian's package starts a system cluster on 5432; ours never uses it.
    BIN="$(find_bindir)" || { log "postgresql installed but initdb not found"; exit 1; }
  fi
}

# As root, the server runs as the postgres system user (initdb refuses root); otherwise as the caller.
as_owner() {
  if [ "$(id -u)" -eq 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

# The data folder: under the clone when the owner can reach it, else keyed to the clone under /var/lib.
data_dir() {
  local local_dir="$ROOT/.data/$NAME"
  if [ "$(id -u)" -ne 0 ]; then echo "$local_dir"; return; fi
  mkdir -p "$ROOT/.data"
  if (cd / && runuser -u postgres -- test -x "$ROOT/.data" && runuser -u postgres -- test -r "$ROOT/.data") 2>/dev/null; then
    echo "$local_dir"; return
  fi
  local key
  key="$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)"
  echo "/var/lib/ampwright/$key/$NAME"
}

is_running() { as_owner "$BIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }

start() {
  ensure_binaries
  DATA="$(data_dir)"
  if [ ! -s "$DATA/PG_VERSION" ]; then
    log "creating cluster in $DATA"
    mkdir -p "$DATA"
    [ "$(id -u)" -eq 0 ] && chown -R postgres:postgres "$(dirname "$DATA")" "$DATA"
    chmod 700 "$DATA"
    as_owner "$BIN/initdb" -D "$DATA" -U "$ROLE" --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
    {
      echo "listen_addresses = '127.0.0.1'"
      echo "port = $PORT"
      echo "unix_socket_directories = '$DATA'"
      echo "max_connections = 100"
      echo "shared_buffers = 128MB"
      if [ "${AMP_PG_FAST:-0}" = "1" ]; then
        echo "fsync = off"; echo "synchronous_commit = off"; echo "full_page_writes = off"
      fi
    } >>"$DATA/postgresql.conf"
    # Loopback only, for this project's own role.
    printf 'local all all trust\nhost all %s 127.0.0.1/32 trust\n' "$ROLE" >"$DATA/pg_hba.conf"
  fi
  if is_running; then
    log "already running on 127.0.0.1:$PORT ($DATA)"
  else
    if (exec 3<>"/dev/tcp/127.0.0.1/$PORT") 2>/dev/null; then
      log "port $PORT on 127.0.0.1 is taken by another program (another Ampwright clone's database?)."
      log "Stop it, or choose another port: AMP_PG_PORT=<port> (and DATABASE_URL to match)."
      exit 1
    fi
    if [ -f "$DATA/postmaster.pid" ]; then
      log "removing a stale postmaster.pid left by a crash"
      rm -f "$DATA/postmaster.pid"
    fi
    as_owner "$BIN/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 30 -o "-p $PORT" start >/dev/null ||
      { log "PostgreSQL did not start; last lines of $DATA/server.log:"; tail -n 20 "$DATA/server.log" >&2; exit 1; }
    log "started on 127.0.0.1:$PORT ($DATA)"
  fi
  if ! as_owner "$BIN/psql" -h "$DATA" -p "$PORT" -U "$ROLE" -d postgres -tAc "select 1 from pg_database where datname='$DBNAME'" | grep -q 1; then
    as_owner "$BIN/createdb" -h "$DATA" -p "$PORT" -U "$ROLE" "$DBNAME"
    log "created database $DBNAME"
  fi
}

stop() {
  BIN="$(find_bindir)" || exit 0
  DATA="$(data_dir)"
  [ -s "$DATA/PG_VERSION" ] || exit 0
  if is_running; then
    as_owner "$BIN/pg_ctl" -D "$DATA" -m fast -w -t 30 stop >/dev/null && log "stopped ($DATA)"
  fi
}

destroy() {
  stop || true
  DATA="$(data_dir)"
  rm -rf "$DATA"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  destroy) destroy ;;
  status) ensure_binaries; DATA="$(data_dir)"; is_running && echo "running $DATA" || echo "stopped $DATA" ;;
  url) echo "postgres://$ROLE@127.0.0.1:$PORT/$DBNAME" ;;
  *) echo "usage: scripts/db.sh start|stop|status|destroy|url" >&2; exit 2 ;;
esac
