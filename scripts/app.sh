#!/usr/bin/env bash
# `npm run app`: set up everything on a fresh machine (npm packages, PostgreSQL, migrations, demo seed, fake SMTP),
# build when needed and serve Fluxfolio on http://127.0.0.1:${PORT:-3000}. Ctrl-C stops everything it started.
# The dev mailbox page stays off unless FLUXFOLIO_DEV_MAILBOX=1 (then for site admins only).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
install_cleanup_trap

PORT="${PORT:-3000}"
SMTP_PORT="${SMTP_PORT:-2525}"
HOST=127.0.0.1

step "Checking npm packages"
ensure_node_modules
require_free_port "$HOST" "$PORT" "the web server" PORT

step "PostgreSQL"
SEED_DEMO="${FLUXFOLIO_SEED_DEMO:-}"
if [ -n "${DATABASE_URL:-}" ]; then
  info "DATABASE_URL is set: using it (no local server started; migrations as DATABASE_OWNER_URL when set)"
  SEED_DEMO="${SEED_DEMO:-0}"
else
  start_local_postgres
  # The app connects as the app role (rows only); migrations run as the owner role.
  DATABASE_URL="$(bash scripts/pg.sh url fluxfolio)"
  DATABASE_OWNER_URL="$(bash scripts/pg.sh owner-url fluxfolio)"
  export DATABASE_OWNER_URL
  SEED_DEMO="${SEED_DEMO:-1}"
fi
export DATABASE_URL

step "Migrating and seeding"
"$BIN/tsx" db/migrate.ts --create
unset DATABASE_OWNER_URL # nothing after the migrations needs the owner role
# The demo seed only for the local demo database (or when asked with FLUXFOLIO_SEED_DEMO=1), and it adds nothing
# to a database that already has users.
if [ "$SEED_DEMO" = 1 ]; then "$BIN/tsx" db/seed.ts; else info "demo seed skipped (FLUXFOLIO_SEED_DEMO=1 adds it to an empty database)"; fi

step "Mail"
if [ -n "${SMTP_URL:-}" ]; then
  info "SMTP_URL is set: sending mail there (no fake SMTP server started)"
else
  export MAIL_DIR="${MAIL_DIR:-$ROOT/.data/mail}"
  require_free_port "$HOST" "$SMTP_PORT" "the fake SMTP server" SMTP_PORT
  start_service smtp "$ROOT/.data/logs/smtp.log" node scripts/smtp.mjs --host "$HOST" --port "$SMTP_PORT" --dir "$MAIL_DIR"
  wait_for_port smtp "$HOST" "$SMTP_PORT" 20
  export SMTP_URL="smtp://$HOST:$SMTP_PORT?ignoreTLS=true"
fi

export NEXTAUTH_URL="${NEXTAUTH_URL:-http://$HOST:$PORT}"
export APP_URL="${APP_URL:-$NEXTAUTH_URL}"
export FLUXFOLIO_DEV_MAILBOX="${FLUXFOLIO_DEV_MAILBOX:-0}"
ensure_nextauth_secret

if build_is_stale; then next_build; else step "Build is newer than the sources: skipping next build"; fi

if [ -f scripts/worker.ts ]; then
  step "Job worker"
  start_service worker "$ROOT/.data/logs/worker.log" "$BIN/tsx" scripts/worker.ts
fi

step "Web server"
start_service web "$ROOT/.data/logs/web.log" "$BIN/next" start -H "$HOST" -p "$PORT"
wait_for_port web "$HOST" "$PORT" 60

step "Fluxfolio is running"
info "Open:        $NEXTAUTH_URL"
info "Sign in with (demo accounts, password sign-in):"
"$BIN/tsx" --eval "import { DEMO_ACCOUNTS } from './db/demo-accounts.ts';
for (const a of DEMO_ACCOUNTS) console.log('      ' + a.role.padEnd(11) + a.email.padEnd(52) + a.password);"
if [ -n "${MAIL_DIR:-}" ] && [ "$FLUXFOLIO_DEV_MAILBOX" = 1 ]; then
  info "Dev mailbox: $NEXTAUTH_URL/dev/mailbox (site admins only; files in ${MAIL_DIR#"$ROOT"/})"
elif [ -n "${MAIL_DIR:-}" ]; then
  info "Mail:        files in ${MAIL_DIR#"$ROOT"/} (FLUXFOLIO_DEV_MAILBOX=1 npm run app shows them to site admins)"
fi
info "Logs:        .data/logs/   Stop: Ctrl-C"

# Serve until a service exits or we are asked to stop (the traps then stop the rest).
set +e
wait -n "${SERVICE_PIDS[@]}"
status=$?
set -e
for i in "${!SERVICE_PIDS[@]}"; do
  if ! kill -0 "${SERVICE_PIDS[$i]}" 2>/dev/null; then
    show_log_tail "${SERVICE_LOGS[$i]}"
    printf '\n%s stopped unexpectedly (exit %s)\n' "${SERVICE_NAMES[$i]}" "$status" >&2
  fi
done
exit "$status"
