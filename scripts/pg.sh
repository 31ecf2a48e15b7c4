#!/usr/bin/env bash
# Local PostgreSQL for Fluxfolio: install (Debian), initialise with password roles, start on 127.0.0.1, stop, status,
# and create/drop databases. TCP needs a password (scram-sha-256); the superuser only logs in over the Unix socket as the
# cluster's OS owner. Roles: fluxfolio_owner (migrations, owns the tables) and fluxfolio_app (the app: rows only).
# Usage: scripts/pg.sh start|stop|status|url [NAME]|owner-url [NAME]|ensure-db NAME|drop-db NAME
#   (env: PGPORT, PGDATA, PG_BIN, FLUXFOLIO_PG_FAST, FLUXFOLIO_PG_MARKER)
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PG_HOST=127.0.0.1
PG_PORT="${PGPORT:-54329}"
PG_SUPERUSER=postgres
PG_SOCKET_DIR=/tmp
DEFAULT_DB=fluxfolio
OWNER_ROLE=fluxfolio_owner
APP_ROLE=fluxfolio_app
# The role passwords live in the cluster's data directory (mode 0600), generated at first start.
ROLES_FILE_NAME=fluxfolio-roles.env

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

# psql as the superuser over the Unix socket (peer authentication: the OS user that owns the cluster). PSQL_DB picks
# the database (default postgres). SQL may come on stdin, which keeps passwords out of the process list.
psql_admin() {
  as_pg "$PG_BIN/psql" -X -v ON_ERROR_STOP=1 -q -h "$PG_SOCKET_DIR" -p "$PG_PORT" -U "$PG_SUPERUSER" -d "${PSQL_DB:-postgres}" "$@"
}

# The data directory of the server on the port: ours, or (another clone's) as the server reports it.
server_data_dir() {
  if ours_running; then printf '%s\n' "$PG_DATA"; return 0; fi
  psql_admin -tAc 'SHOW data_directory' 2>/dev/null ||
    die "cannot log in to the PostgreSQL server on port $PG_PORT as its owner (another user's server?); choose another PGPORT or set DATABASE_URL"
}

random_password() { od -An -tx1 -N24 /dev/urandom | tr -d ' \n'; }

# ensure_roles_file DIR: create DIR/fluxfolio-roles.env with two fresh passwords unless it exists (mode 0600).
ensure_roles_file() {
  local file="$1/$ROLES_FILE_NAME"
  [ -s "$file" ] && return 0
  (umask 077 && printf 'OWNER_PASSWORD=%s\nAPP_PASSWORD=%s\n' "$(random_password)" "$(random_password)" >"$file")
  chmod 600 "$file"
  log "generated passwords for $OWNER_ROLE and $APP_ROLE into $file"
}

# role_password OWNER|APP: the password from the roles file of this port's cluster.
role_password() {
  local file="$PG_DATA/$ROLES_FILE_NAME"
  if [ ! -s "$file" ] && port_answers; then file="$(server_data_dir)/$ROLES_FILE_NAME"; fi
  [ -s "$file" ] || die "no role passwords yet ($file): run scripts/pg.sh start first"
  sed -n "s/^$1_PASSWORD=//p" "$file"
}

# pg_hba.conf and pg_ident.conf: passwords on TCP, the superuser only over the socket for the cluster's OS owner.
write_auth_config() {
  local dir="$1" hba ident changed=0
  hba="# Written by scripts/pg.sh: password (scram-sha-256) on 127.0.0.1; the superuser only over the Unix socket.
local   all   $PG_SUPERUSER                   peer map=fluxfolio
host    all   all            127.0.0.1/32   scram-sha-256
host    all   all            ::1/128        scram-sha-256"
  ident="# Written by scripts/pg.sh: OS users that may log in as $PG_SUPERUSER over the socket.
fluxfolio   $PG_SUPERUSER   $PG_SUPERUSER"
  if ! is_root && [ "$(id -un)" != "$PG_SUPERUSER" ]; then ident="$ident
fluxfolio   $(id -un)   $PG_SUPERUSER"; fi
  if [ "$(cat "$dir/pg_hba.conf" 2>/dev/null)" != "$hba" ]; then printf '%s\n' "$hba" >"$dir/pg_hba.conf"; changed=1; fi
  if [ "$(cat "$dir/pg_ident.conf" 2>/dev/null)" != "$ident" ]; then printf '%s\n' "$ident" >"$dir/pg_ident.conf"; changed=1; fi
  if is_root; then chown "$PG_SUPERUSER:" "$dir/pg_hba.conf" "$dir/pg_ident.conf"; fi
  chmod 600 "$dir/pg_hba.conf" "$dir/pg_ident.conf"
  [ "$changed" -eq 1 ]
}

# Give every object of a database's schemas to its role: public and drizzle to the owner role, pgboss to the app role
# (pg-boss alters its own tables when it adds a queue). Objects owned through a table (serial sequences, indexes) follow it.
transfer_ownership_sql() {
  cat <<SQL
SELECT format('ALTER DATABASE %I OWNER TO $OWNER_ROLE', current_database())
  WHERE pg_get_userbyid((SELECT datdba FROM pg_database WHERE datname = current_database())) <> '$OWNER_ROLE' \gexec
CREATE TEMP VIEW fluxfolio_target AS
  SELECT n.oid, n.nspname, CASE WHEN n.nspname = 'pgboss' THEN '$APP_ROLE' ELSE '$OWNER_ROLE' END AS role
  FROM pg_namespace n WHERE n.nspname IN ('public', 'drizzle', 'pgboss');
SELECT format('ALTER SCHEMA %I OWNER TO %I', t.nspname, t.role) FROM fluxfolio_target t JOIN pg_namespace n ON n.oid = t.oid
  WHERE pg_get_userbyid(n.nspowner) NOT IN (t.role, 'pg_database_owner') \gexec
SELECT format('ALTER %s %s OWNER TO %I',
    CASE c.relkind WHEN 'S' THEN 'SEQUENCE' WHEN 'v' THEN 'VIEW' WHEN 'm' THEN 'MATERIALIZED VIEW' WHEN 'f' THEN 'FOREIGN TABLE' ELSE 'TABLE' END,
    c.oid::regclass, t.role)
  FROM pg_class c JOIN fluxfolio_target t ON t.oid = c.relnamespace
  WHERE c.relkind IN ('r', 'p', 'S', 'v', 'm', 'f') AND pg_get_userbyid(c.relowner) <> t.role
    AND (c.relkind <> 'S' OR NOT EXISTS (SELECT 1 FROM pg_depend d WHERE d.classid = 'pg_class'::regclass AND d.objid = c.oid AND d.objsubid = 0
                    AND d.refclassid = 'pg_class'::regclass AND d.deptype IN ('a', 'i'))) \gexec
SELECT format('ALTER TYPE %s OWNER TO %I', ty.oid::regtype, t.role)
  FROM pg_type ty JOIN fluxfolio_target t ON t.oid = ty.typnamespace
  WHERE ty.typtype IN ('e', 'd') AND pg_get_userbyid(ty.typowner) <> t.role \gexec
SELECT format('ALTER ROUTINE %s OWNER TO %I', p.oid::regprocedure, t.role)
  FROM pg_proc p JOIN fluxfolio_target t ON t.oid = p.pronamespace
  WHERE p.prokind IN ('f', 'p') AND pg_get_userbyid(p.proowner) <> t.role \gexec
SQL
}

# Create or update the two roles with the passwords of DIR, hand Fluxfolio's databases of an earlier (trust-only)
# version to them, then switch authentication to passwords and reload. Idempotent: every start runs it.
ensure_roles() {
  local dir="$1" db
  ensure_roles_file "$dir"
  local owner_password app_password
  owner_password="$(sed -n 's/^OWNER_PASSWORD=//p' "$dir/$ROLES_FILE_NAME")"
  app_password="$(sed -n 's/^APP_PASSWORD=//p' "$dir/$ROLES_FILE_NAME")"
  psql_admin <<SQL
SELECT 'CREATE ROLE $OWNER_ROLE' WHERE NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '$OWNER_ROLE') \gexec
SELECT 'CREATE ROLE $APP_ROLE' WHERE NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '$APP_ROLE') \gexec
ALTER ROLE $OWNER_ROLE WITH LOGIN CREATEDB NOSUPERUSER NOCREATEROLE NOREPLICATION NOBYPASSRLS PASSWORD '$owner_password';
ALTER ROLE $APP_ROLE WITH LOGIN NOCREATEDB NOSUPERUSER NOCREATEROLE NOREPLICATION NOBYPASSRLS PASSWORD '$app_password';
SET client_min_messages = warning;
-- The owner may act for the app role: hand pg-boss's schema over to it, and close its sessions when dropping a database.
GRANT $APP_ROLE TO $OWNER_ROLE;
SQL
  for db in $(psql_admin -tAc "SELECT datname FROM pg_database WHERE datname LIKE 'fluxfolio%' AND NOT datistemplate
                               AND pg_get_userbyid(datdba) <> '$OWNER_ROLE'"); do
    log "handing database $db of an earlier version to $OWNER_ROLE (pg-boss tables to $APP_ROLE)"
    transfer_ownership_sql | PSQL_DB="$db" psql_admin
  done
  if write_auth_config "$dir"; then
    psql_admin -tAc 'SELECT pg_reload_conf()' >/dev/null
    log "authentication: passwords (scram-sha-256) on $PG_HOST, superuser over the socket only"
  fi
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
    ensure_roles "$PG_DATA"
    write_marker reused; return 0
  fi
  if port_answers; then
    log "a PostgreSQL server (another clone's or a system one) already answers on $PG_HOST:$PG_PORT: using it"
    ensure_roles "$(server_data_dir)"
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
    as_pg "$PG_BIN/initdb" -D "$PG_DATA" -U "$PG_SUPERUSER" --auth-local=peer --auth-host=scram-sha-256 \
      -E UTF8 --locale=C.UTF-8 >/dev/null
    write_auth_config "$PG_DATA" || true
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
  ensure_roles "$PG_DATA"
  write_marker started
  log "ready: $(cmd_url "$DEFAULT_DB" | sed 's/:[^:@]*@/:***@/')"
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

# The URL the app uses (app role) and the one migrations use (owner role); the passwords are hex, safe in a URL.
cmd_url() { printf 'postgres://%s:%s@%s:%s/%s\n' "$APP_ROLE" "$(role_password APP)" "$PG_HOST" "$PG_PORT" "${1:-$DEFAULT_DB}"; }
cmd_owner_url() { printf 'postgres://%s:%s@%s:%s/%s\n' "$OWNER_ROLE" "$(role_password OWNER)" "$PG_HOST" "$PG_PORT" "${1:-$DEFAULT_DB}"; }

cmd_ensure_db() {
  check_db_name "${1:-}"
  PG_BIN="$(find_pg_bin)"
  port_answers || die "no PostgreSQL server answers on $PG_HOST:$PG_PORT (run: scripts/pg.sh start)"
  if [ "$(psql_admin -tAc "SELECT 1 FROM pg_database WHERE datname = '$1'")" = 1 ]; then
    log "database $1 exists"
  else
    psql_admin -c "CREATE DATABASE \"$1\" OWNER $OWNER_ROLE"
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
usage: scripts/pg.sh start|stop|status|url [NAME]|owner-url [NAME]|ensure-db NAME|drop-db NAME
  url: the app role's URL (rows only); owner-url: the owner role's URL (migrations)
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
  url) PG_BIN="$(find_pg_bin)"; cmd_url "${2:-}" ;;
  owner-url) PG_BIN="$(find_pg_bin)"; cmd_owner_url "${2:-}" ;;
  ensure-db) cmd_ensure_db "${2:-}" ;;
  drop-db) cmd_drop_db "${2:-}" ;;
  *) usage ;;
esac
