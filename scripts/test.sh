#!/usr/bin/env bash
# `npm test [-- vitest args]`: the same bootstrap as `npm run app` against a separate, freshly migrated test database,
# then the built app on 127.0.0.1:${TEST_APP_PORT:-3100} with a fake SMTP server, then vitest (unit, integration, browser).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
install_cleanup_trap

HOST=127.0.0.1
TEST_DATABASE_NAME_GIVEN="${TEST_DATABASE_NAME:-}"
TEST_DATABASE_NAME="${TEST_DATABASE_NAME:-fluxfolio_test}"
APP_PORT="${TEST_APP_PORT:-3100}"
SMTP_PORT="${TEST_SMTP_PORT:-2526}"
export FLUXFOLIO_PG_FAST=1
[[ "$TEST_DATABASE_NAME" =~ ^[a-z_][a-z0-9_]{0,62}$ ]] || die "TEST_DATABASE_NAME must be lower-case letters, digits and _" 2
[ "$TEST_DATABASE_NAME" != fluxfolio ] || die "TEST_DATABASE_NAME must not be the dev database 'fluxfolio' (it is dropped)" 2

step "Checking npm packages"
ensure_node_modules
require_free_port "$HOST" "$APP_PORT" "the test web server" TEST_APP_PORT
require_free_port "$HOST" "$SMTP_PORT" "the test fake SMTP server" TEST_SMTP_PORT

step "PostgreSQL for the tests"
with_database() { node -e 'const u = new URL(process.argv[1]); u.pathname = "/" + process.argv[2]; console.log(u.toString())' "$1" "$2"; }
if [ -n "${TEST_DATABASE_URL:-}" ]; then
  info "TEST_DATABASE_URL is set: using it (migrations as TEST_DATABASE_OWNER_URL when set)"
  DATABASE_URL="$TEST_DATABASE_URL"
  DATABASE_OWNER_URL="${TEST_DATABASE_OWNER_URL:-$TEST_DATABASE_URL}"
elif [ -n "${DATABASE_URL:-}" ]; then
  info "DATABASE_URL is set: using its server with the database $TEST_DATABASE_NAME"
  DATABASE_OWNER_URL="$(with_database "${DATABASE_OWNER_URL:-$DATABASE_URL}" "$TEST_DATABASE_NAME")"
  DATABASE_URL="$(with_database "$DATABASE_URL" "$TEST_DATABASE_NAME")"
else
  start_local_postgres
  if [ "$PG_SERVER_IS_OTHER" -eq 1 ] && [ -z "$TEST_DATABASE_NAME_GIVEN" ]; then
    # Another clone's server: use a database of our own so that two clones never drop each other's test data.
    TEST_DATABASE_NAME="fluxfolio_test_$(clone_id)"
    info "the server belongs to another clone: using the database $TEST_DATABASE_NAME"
  fi
  DATABASE_URL="$(bash scripts/pg.sh url "$TEST_DATABASE_NAME")"
  DATABASE_OWNER_URL="$(bash scripts/pg.sh owner-url "$TEST_DATABASE_NAME")"
fi
# The app, the worker and the tests' fixtures connect as DATABASE_URL (the app role); migrations and the tests that
# need the owner (scratch databases, the trigger checks) use DATABASE_OWNER_URL.
export DATABASE_URL DATABASE_OWNER_URL TEST_DATABASE_NAME
info "test database: $TEST_DATABASE_NAME (dropped, recreated and migrated)"
"$BIN/tsx" db/migrate.ts --recreate

step "Chromium for the browser tests"
export CHROMIUM_PATH="${CHROMIUM_PATH:-/usr/bin/chromium}"
if [ "$CHROMIUM_PATH" = /usr/bin/chromium ]; then ensure_apt_package chromium /usr/bin/chromium; fi
[ -x "$CHROMIUM_PATH" ] || die "CHROMIUM_PATH=$CHROMIUM_PATH is not an executable"
info "using $CHROMIUM_PATH"

step "Fake SMTP for the tests"
export MAIL_DIR="$ROOT/.data/test-mail"
rm -rf "$MAIL_DIR"
mkdir -p "$MAIL_DIR" "$ROOT/test-results"
start_service smtp "$ROOT/.data/logs/test-smtp.log" node scripts/smtp.mjs --host "$HOST" --port "$SMTP_PORT" --dir "$MAIL_DIR"
wait_for_port smtp "$HOST" "$SMTP_PORT" 20
export SMTP_URL="smtp://$HOST:$SMTP_PORT?ignoreTLS=true"

if [ "${FLUXFOLIO_SKIP_BUILD:-0}" = 1 ] && [ -f .next/BUILD_ID ]; then
  step "FLUXFOLIO_SKIP_BUILD=1: reusing the existing build"
else
  next_build
fi

export APP_URL="http://$HOST:$APP_PORT"
export NEXTAUTH_URL="$APP_URL"
NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(node -e 'process.stdout.write(require("node:crypto").randomBytes(32).toString("base64url"))')}"
export NEXTAUTH_SECRET
export FLUXFOLIO_DEV_MAILBOX=1

if [ -f scripts/worker.ts ]; then
  step "Job worker against the test database"
  start_service worker "$ROOT/.data/logs/test-worker.log" env -u DATABASE_OWNER_URL "$BIN/tsx" scripts/worker.ts
fi

step "Test web server on $APP_URL"
start_service web "$ROOT/.data/logs/test-web.log" env -u DATABASE_OWNER_URL "$BIN/next" start -H "$HOST" -p "$APP_PORT"
wait_for_port web "$HOST" "$APP_PORT" 60

step "vitest run $*"
VITEST_LOG="$ROOT/test-results/vitest.log"
set +e
"$BIN/vitest" run "$@" 2>&1 | tee "$VITEST_LOG"
status=${PIPESTATUS[0]}
set -e

cleanup
step "Summary (full output: test-results/vitest.log; server logs: .data/logs/test-*.log)"
sed -e 's/\x1b\[[0-9;]*m//g' "$VITEST_LOG" | grep -E '^ *(Test Files|Tests|Errors|Duration) ' || info "vitest printed no summary"
# One plain closing line with the counts ("N passed, N failed"), read by CI whatever the runner.
counts="$(sed -e 's/\x1b\[[0-9;]*m//g' "$VITEST_LOG" | grep -E '^ *Tests ' | tail -n 1)"
passed="$(printf '%s' "$counts" | grep -oE '[0-9]+ passed' | grep -oE '[0-9]+' || echo 0)"
failed="$(printf '%s' "$counts" | grep -oE '[0-9]+ failed' | grep -oE '[0-9]+' || echo 0)"
skipped="$(printf '%s' "$counts" | grep -oE '[0-9]+ skipped' | grep -oE '[0-9]+' || true)"
if [ "$status" -eq 0 ]; then info "all tests passed"; else info "vitest exited with status $status"; fi
if [ -n "$skipped" ]; then echo "tests: ${passed:-0} passed, ${failed:-0} failed, $skipped skipped"; else echo "tests: ${passed:-0} passed, ${failed:-0} failed"; fi
exit "$status"
