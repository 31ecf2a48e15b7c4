#!/usr/bin/env bash
# Local PostgreSQL for Fluxfolio: install (Debian), initialise, start on 127.0.0.1, stop, status, and create/drop databases.
# Usage: scripts/pg.sh start|stop|status|url [NAME]|ensure-db NAME|drop-db NAME   (env: PGPORT, PGDATA, PG_BIN, FLUXFOLIO_PG_FAST, FLUXFOLIO_PG_MARKER)
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PG_HOST=127.0.0.1
PG_PORT="${PGPORT:-54329}"
PG_SUPERUSER=postgres
PG_SOCKET_DIR=/tmp
DEFAULT_DB=fluxfolio

log() { printf '[pg] %s\n' "$*"; }
die() { printf '[pg] error: %s\n' "$1" >&2; exit "${2:-1}"; }

is_root() { [ "$(id -u)" -eq 0 ]; }

# Newest installed server version unless PG_BIN is given.
find_pg_bin() {
  if [ -n "${PG_BIN:-}" ]; then printf '%s\n' "$PG_BIN"; return; fi
  local dir
  dir="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)"
  printf '%s\n' "${dir:-/usr/lib/postgresql/15/bin}"
}

ensure_installed() {
  PG_BIN="$(find_pg_bin)"
  [ -x "$PG_BIN/initdb" ] && return 0
  is_root || die "PostgreSQL server binaries not found in $PG_BIN; install the Debian package 'postgresql' (needs root)"
  log "PostgreSQL server binaries missing: installing Debian package 'postgresql' (apt-get)"
  export DEBIAN_FRONTEND=noninteractive
  flock /tmp/fluxfolio-apt.lock apt-get update -q </dev/null
  flock /tmp/fluxfolio-apt.lock apt-get install -y -q --no-install-recommends -o DPkg::Lock::Timeout=300 postgresql </dev/null
  PG_BIN="$(find_pg_bin)"
  [ -x "$PG_BIN/initdb" ] || die "apt-get installed postgresql but $PG_BIN/initdb is still missing"
}

ensure_user() {
  is_root || return 0
  id -u "$PG_SUPERUSER" >/dev/null 2>&1 && return 0
  log "creating system user '$PG_SUPERUSER'"
  useradd --system --home-dir /nonexistent --shell /usr/sbin/nologin "$PG_SUPERUSER"
}

# Run a PostgreSQL tool as the unprivileged owner of the data directory (initdb/postgres refuse root).
as_pg() {
  # From / : the postgres user may not be allowed into the caller's working directory.
  if is_root; then (cd / && runuser -u "$PG_SUPERUSER" -- "$@"); else "$@"; fi
}

# .data/pg in the project when the postgres user can reach it; otherwise a per-clone directory under /var/tmp.
resolve_pgdata() {
  if [ -n "${PGDATA:-}" ]; then
    case "$PGDATA" in /*) printf '%s\n' "$PGDATA" ;; *) printf '%s/%s\n' "$PWD" "$PGDATA" ;; esac
    return
  fi
  if ! is_root || { id -u "$PG_SUPERUSER" >/dev/null 2>&1 && (cd / && runuser -u "$PG_SUPERUSER" -- test -x "$ROOT"); }; then
    printf '%s\n' "$ROOT/.data/pg"
  else
    printf '/var/tmp/fluxfolio-pg-%s\n' "$(printf '%s' "$ROOT" | sha256sum | cut -c1-10)"
  fi
}

ours_running() { [ -f "$PG_DATA/PG_VERSION" ] && as_pg "$PG_BIN/pg_ctl" -D "$PG_DATA" status >/dev/null 2>&1; }

port_answers() {
  if [ -x "${PG_BIN:-}/pg_isready" ]; then
    "$PG_BIN/pg_isready" -q -h "$PG_HOST" -p "$PG_PORT" -t 2
  else
    (exec 3<>"/dev/tcp/$PG_HOST/$PG_PORT") 2>/dev/null
  fi
}

write_marker() { [ -n "${FLUXFOLIO_PG_MARKER:-}" ] && printf '%s\n' "$1" >"$FLUXFOLIO_PG_MARKER"; return 0; }

psql_admin() {
  "$PG_BIN/psql" -X -v ON_ERROR_STOP=1 -q -h "$PG_HOST" -p "$PG_PORT" -U "$PG_SUPERUSER" -d postgres "$@"
}

check_db_name() {
  [ -n "${1:-}" ] || die "missing database name" 2
  [[ "$1" =~ ^[a-z_][a-z0-9_]{0,62}$ ]] || die "invalid database name '$1' (use lower-case letters, digits and _)" 2
}

cmd_start() {
  ensure_installed
  ensure_user
  # The postgres user may have just been created: decide where the data lives now that it exists.
  PG_DATA="$(resolve_pgdata)"
  if ours_running; then
    log "already running on $PG_HOST:$PG_PORT (data $PG_DATA): nothing to do"
    write_marker reused; return 0
  fi
  if port_answers; then
    log "a PostgreSQL server (another clone's or a system one) already answers on $PG_HOST:$PG_PORT: using it"
    write_marker other; return 0
  fi
  mkdir -p "$PG_DATA"
  if is_root; then chown "$PG_SUPERUSER:" "$PG_DATA"; fi
  chmod 700 "$PG_DATA"
  if is_root && ! (cd / && runuser -u "$PG_SUPERUSER" -- test -x "$PG_DATA"); then
    die "the '$PG_SUPERUSER' user cannot reach $PG_DATA (a parent folder is not traversable); set PGDATA to a path under /var/tmp"
  fi
  if [ ! -f "$PG_DATA/PG_VERSION" ]; then
    log "initialising a new cluster in $PG_DATA"
    as_pg "$PG_BIN/initdb" -D "$PG_DATA" -U "$PG_SUPERUSER" --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  local opts="-c listen_addresses=$PG_HOST -p $PG_PORT -k $PG_SOCKET_DIR"
  if [ "${FLUXFOLIO_PG_FAST:-0}" = 1 ]; then
    opts="$opts -c fsync=off -c synchronous_commit=off -c full_page_writes=off"
  fi
  log "starting on $PG_HOST:$PG_PORT (data $PG_DATA)"
  if ! as_pg "$PG_BIN/pg_ctl" -D "$PG_DATA" -l "$PG_DATA/server.log" -w -t 60 start -o "$opts" >/dev/null 9>&-; then
    tail -n 20 "$PG_DATA/server.log" >&2 || true
    die "PostgreSQL did not start (log: $PG_DATA/server.log)"
  fi
  write_marker started
  log "ready: $(cmd_url "$DEFAULT_DB")"
}

cmd_stop() {
  PG_BIN="$(find_pg_bin)"
  [ -x "$PG_BIN/pg_ctl" ] || { log "PostgreSQL is not installed: nothing to stop"; return 0; }
  if ! ours_running; then log "not running (data $PG_DATA): nothing to stop"; return 0; fi
  as_pg "$PG_BIN/pg_ctl" -D "$PG_DATA" -m fast -w -t 60 stop >/dev/null
  log "stopped (data $PG_DATA)"
}

cmd_status() {
  PG_BIN="$(find_pg_bin)"
  if [ -x "$PG_BIN/pg_ctl" ] && ours_running; then
    log "running on $PG_HOST:$PG_PORT (data $PG_DATA)"; return 0
  fi
  if port_answers; then
    log "another PostgreSQL server answers on $PG_HOST:$PG_PORT (not started from $PG_DATA)"; return 0
  fi
  log "down (port $PG_PORT, data $PG_DATA)"; return 3
}

cmd_url() { printf 'postgres://%s@%s:%s/%s\n' "$PG_SUPERUSER" "$PG_HOST" "$PG_PORT" "${1:-$DEFAULT_DB}"; }

cmd_ensure_db() {
  check_db_name "${1:-}"
  PG_BIN="$(find_pg_bin)"
  port_answers || die "no PostgreSQL server answers on $PG_HOST:$PG_PORT (run: scripts/pg.sh start)"
  if [ "$(psql_admin -tAc "SELECT 1 FROM pg_database WHERE datname = '$1'")" = 1 ]; then
    log "database $1 exists"
  else
    psql_admin -c "CREATE DATABASE \"$1\""
    log "created database $1"
  fi
}

cmd_drop_db() {
  check_db_name "${1:-}"
  case "$1" in postgres|template0|template1) die "refusing to drop the system database '$1'" 2 ;; esac
  PG_BIN="$(find_pg_bin)"
  port_answers || die "no PostgreSQL server answers on $PG_HOST:$PG_PORT (run: scripts/pg.sh start)"
  psql_admin -c "DROP DATABASE IF EXISTS \"$1\" WITH (FORCE)"
  log "dropped database $1 (if it existed)"
}

usage() {
  cat >&2 <<USAGE
usage: scripts/pg.sh start|stop|status|url [NAME]|ensure-db NAME|drop-db NAME
  PGPORT (default 54329), PGDATA (default .data/pg, or /var/tmp/fluxfolio-pg-<hash> when the postgres user cannot reach the project),
  FLUXFOLIO_PG_FAST=1 (fsync off: tests only), FLUXFOLIO_PG_MARKER=FILE (start writes there: 'started', 'reused' (ours, already up) or 'other' (another server))
USAGE
  exit 2
}

PG_DATA="$(resolve_pgdata)"
case "${1:-}" in
  start) exec 9>"/tmp/fluxfolio-pg-$PG_PORT.lock"; flock 9; cmd_start ;;
  stop) exec 9>"/tmp/fluxfolio-pg-$PG_PORT.lock"; flock 9; cmd_stop ;;
  status) cmd_status ;;
  url) cmd_url "${2:-}" ;;
  ensure-db) cmd_ensure_db "${2:-}" ;;
  drop-db) cmd_drop_db "${2:-}" ;;
  *) usage ;;
esac
