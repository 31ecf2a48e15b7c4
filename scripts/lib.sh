#!/usr/bin/env bash
# Shared shell helpers for scripts/app.sh and scripts/test.sh: logging, npm/apt bootstrap, background services in
# their own process groups, waiting for ports, and one cleanup trap that stops everything this run started.
# Source it: `source "$(dirname "$0")/lib.sh"`; it sets ROOT and changes into it.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
export NEXT_TELEMETRY_DISABLED=1
export DEBIAN_FRONTEND=noninteractive
BIN="$ROOT/node_modules/.bin"

if [ -t 1 ]; then BOLD=$'\033[1m' RED=$'\033[31m' PLAIN=$'\033[0m'; else BOLD='' RED='' PLAIN=''; fi
step() { printf '\n%s==> %s%s\n' "$BOLD" "$*" "$PLAIN"; }
info() { printf '    %s\n' "$*"; }
die() { printf '\n%serror:%s %s\n' "$RED" "$PLAIN" "$1" >&2; exit "${2:-1}"; }

# ---------------------------------------------------------------------------------------------------------------
# Packages
# ---------------------------------------------------------------------------------------------------------------

# npm ci when node_modules is missing or older than package-lock.json (npm records its install in .package-lock.json).
ensure_node_modules() {
  local marker="$ROOT/node_modules/.package-lock.json"
  if [ -f "$marker" ] && [ ! "$ROOT/package-lock.json" -nt "$marker" ] && [ -x "$BIN/next" ]; then
    info "node_modules is up to date"
    return 0
  fi
  step "Installing npm packages (npm ci)"
  flock /tmp/fluxfolio-npm.lock npm ci --no-audit --no-fund </dev/null || die "npm ci failed"
}

APT_UPDATED=0
# ensure_apt_package PACKAGE PATH: install the Debian package when PATH (a file it provides) is missing.
ensure_apt_package() {
  local package="$1" provides="$2"
  [ -e "$provides" ] && return 0
  [ "$(id -u)" -eq 0 ] || die "$provides is missing; install the Debian package '$package' (needs root: apt-get install -y $package)"
  step "Installing Debian package $package (apt-get)"
  if [ "$APT_UPDATED" -eq 0 ]; then
    flock /tmp/fluxfolio-apt.lock apt-get update -q </dev/null || die "apt-get update failed"
    APT_UPDATED=1
  fi
  flock /tmp/fluxfolio-apt.lock apt-get install -y -q -o DPkg::Lock::Timeout=300 "$package" </dev/null ||
    die "apt-get install $package failed"
  [ -e "$provides" ] || die "package $package installed but $provides is still missing"
}

# ---------------------------------------------------------------------------------------------------------------
# Ports and background services
# ---------------------------------------------------------------------------------------------------------------

port_open() { (exec 3<>"/dev/tcp/$1/$2") 2>/dev/null; }

# require_free_port HOST PORT WHAT VARIABLE: fail early with a hint instead of a confusing EADDRINUSE later.
require_free_port() {
  if port_open "$1" "$2"; then
    die "port $2 on $1 is already in use ($3); stop what uses it or choose another port with $4=..."
  fi
}

SERVICE_NAMES=()
SERVICE_PIDS=()
SERVICE_LOGS=()

# start_service NAME LOGFILE COMMAND...: run COMMAND in its own session/process group (so that stopping it also stops
# the children it forks, e.g. next-server) and remember it for the cleanup trap.
start_service() {
  local name="$1" logfile="$2"
  shift 2
  mkdir -p "$(dirname "$logfile")"
  setsid "$@" >"$logfile" 2>&1 </dev/null &
  SERVICE_NAMES+=("$name")
  SERVICE_PIDS+=("$!")
  SERVICE_LOGS+=("$logfile")
  info "$name started (pid $!, log ${logfile#"$ROOT"/})"
}

service_pid() {
  local i
  for i in "${!SERVICE_NAMES[@]}"; do
    [ "${SERVICE_NAMES[$i]}" = "$1" ] && { printf '%s\n' "${SERVICE_PIDS[$i]}"; return 0; }
  done
  return 1
}

show_log_tail() { [ -f "$1" ] && { printf -- '---- last lines of %s ----\n' "${1#"$ROOT"/}" >&2; tail -n "${2:-30}" "$1" >&2; }; return 0; }

# wait_for_port NAME HOST PORT TIMEOUT_SECONDS: wait until the service listens; fail early if it died.
wait_for_port() {
  local name="$1" host="$2" port="$3" timeout="$4" pid logfile="" i
  pid="$(service_pid "$name" || true)"
  for i in "${!SERVICE_NAMES[@]}"; do [ "${SERVICE_NAMES[$i]}" = "$name" ] && logfile="${SERVICE_LOGS[$i]}"; done
  local deadline=$((SECONDS + timeout))
  until port_open "$host" "$port"; do
    if [ -n "$pid" ] && ! kill -0 "$pid" 2>/dev/null; then
      show_log_tail "$logfile"
      die "$name exited before listening on $host:$port"
    fi
    [ "$SECONDS" -lt "$deadline" ] || { show_log_tail "$logfile"; die "$name did not listen on $host:$port within ${timeout}s"; }
    sleep 0.3
  done
}

# Stop every service this run started, newest first: SIGTERM to its process group, SIGKILL after 10 s.
stop_services() {
  local i pid
  for ((i = ${#SERVICE_PIDS[@]} - 1; i >= 0; i--)); do
    pid="${SERVICE_PIDS[$i]}"
    if ! kill -0 -- "-$pid" 2>/dev/null; then wait "$pid" 2>/dev/null || true; continue; fi
    kill -TERM -- "-$pid" 2>/dev/null || true
    local waited=0
    while kill -0 -- "-$pid" 2>/dev/null && [ "$waited" -lt 100 ]; do sleep 0.1; waited=$((waited + 1)); done
    kill -KILL -- "-$pid" 2>/dev/null || true
    wait "$pid" 2>/dev/null || true
    info "${SERVICE_NAMES[$i]} stopped"
  done
  SERVICE_PIDS=()
  SERVICE_NAMES=()
  SERVICE_LOGS=()
}

# ---------------------------------------------------------------------------------------------------------------
# PostgreSQL (scripts/pg.sh) and the cleanup trap
# ---------------------------------------------------------------------------------------------------------------

PG_STARTED_HERE=0
PG_SERVER_IS_OTHER=0
# Start the local server unless one already answers; remember whether THIS run started it and whether the server
# on the port belongs to another clone (then callers pick a database name of their own).
start_local_postgres() {
  local marker state
  marker="$(mktemp)"
  FLUXFOLIO_PG_MARKER="$marker" bash "$ROOT/scripts/pg.sh" start || { rm -f "$marker"; die "PostgreSQL did not start"; }
  state="$(cat "$marker")"
  rm -f "$marker"
  [ "$state" = started ] && PG_STARTED_HERE=1
  [ "$state" = other ] && PG_SERVER_IS_OTHER=1
  return 0
}

# A short stable id of this clone's path (for per-clone names on a shared server).
clone_id() { printf '%s' "$ROOT" | sha256sum | cut -c1-8; }

CLEANED_UP=0
cleanup() {
  [ "$CLEANED_UP" -eq 1 ] && return 0
  CLEANED_UP=1
  if [ "${#SERVICE_PIDS[@]}" -gt 0 ] || [ "$PG_STARTED_HERE" -eq 1 ]; then step "Stopping what this run started"; fi
  stop_services
  if [ "$PG_STARTED_HERE" -eq 1 ]; then bash "$ROOT/scripts/pg.sh" stop || true; fi
}

# Run cleanup on any exit; turn Ctrl-C / SIGTERM into an exit with the conventional status.
install_cleanup_trap() {
  trap cleanup EXIT
  trap 'exit 130' INT
  trap 'exit 143' TERM
}

# The next-auth secret: NEXTAUTH_SECRET if set, else one generated once into .data/secret (mode 600).
ensure_nextauth_secret() {
  if [ -n "${NEXTAUTH_SECRET:-}" ]; then return 0; fi
  local file="$ROOT/.data/secret"
  if [ ! -s "$file" ]; then
    mkdir -p "$ROOT/.data"
    (umask 077 && node -e 'process.stdout.write(require("node:crypto").randomBytes(32).toString("base64url"))' >"$file")
    info "generated a NEXTAUTH_SECRET into .data/secret"
  fi
  NEXTAUTH_SECRET="$(cat "$file")"
  export NEXTAUTH_SECRET
}

# True when there is no production build or a source file is newer than it.
build_is_stale() {
  [ -f "$ROOT/.next/BUILD_ID" ] || return 0
  local newer
  newer="$(find app lib db components content hooks types public \
    mdx-components.tsx next.config.mjs package-lock.json tailwind.config.ts postcss.config.mjs tsconfig.json proxy.ts middleware.ts \
    -newer "$ROOT/.next/BUILD_ID" -type f -print -quit 2>/dev/null || true)"
  [ -n "$newer" ]
}

next_build() {
  step "Building the app (next build)"
  flock /tmp/fluxfolio-next.lock "$BIN/next" build </dev/null || die "next build failed"
}
