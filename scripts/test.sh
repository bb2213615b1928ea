#!/usr/bin/env bash
# npm test: the whole suite — vitest unit tests, integration tests against a real PostgreSQL
# (a fresh database per run, cloned from a migrated template), and Playwright browser tests in
# Debian's chromium against `next start`. Prints one "N passed, N failed" line at the end.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
set +e

export PGPORT="${TEST_PGPORT:-54339}"          # a cluster apart from the demo's
export RIMEPLAN_PG_DIR="${RIMEPLAN_TEST_PG_DIR:-}"
[ -n "$RIMEPLAN_PG_DIR" ] || unset RIMEPLAN_PG_DIR
export SMTP_PORT="${TEST_SMTP_PORT:-2535}"
export RIMEPLAN_RUN_DIR="$ROOT/.run/test"
export MAIL_CATCHER_DIR="$RIMEPLAN_RUN_DIR/mail"
export TEST_PORT="${TEST_PORT:-3210}"
export LOG_LEVEL="${LOG_LEVEL:-warn}"
# Test-only: the test cluster runs with fsync=off (see pg_options in lib.sh). It holds only
# databases rebuilt on every run, so a machine crash loses nothing of value; never for the demo.
export RIMEPLAN_PG_FAST=1
mkdir -p "$RIMEPLAN_RUN_DIR"
set -e
ensure_apt postgresql postgresql-client chromium
ensure_node_modules
# A separate cluster folder for tests, so the demo's data is never touched.
if [ -z "${RIMEPLAN_PG_DIR:-}" ]; then export RIMEPLAN_PG_DIR="$(pg_dir)-test"; fi
pg_start
rm -rf "$MAIL_CATCHER_DIR"; smtp_stop; smtp_start
# The test cluster stops with the run, so another checkout can use the same port afterwards.
trap 'smtp_stop; pg_stop' EXIT
set +e

RUN_ID="$(date +%s)_$$"
# Admin work (create and drop databases) as the superuser; the app and the tests as the app's
# role, as in the demo. The fault tests stop and restart this cluster through lib.sh.
ADMIN_DATABASE_URL="$(pg_admin_url postgres)"; export ADMIN_DATABASE_URL
APP_DATABASE_URL="$(pg_app_url postgres)"; export APP_DATABASE_URL
export TEMPLATE_DB="rimeplan_template"

# Template database: migrated once per run, then cloned per suite (fast and always fresh).
psql_admin -d postgres -c "drop database if exists $TEMPLATE_DB with (force)" >/dev/null
pg_create_db "$TEMPLATE_DB" >/dev/null
DATABASE_URL="$(pg_app_url "$TEMPLATE_DB")" node_modules/.bin/tsx scripts/migrate.ts || exit 1
# Old per-run databases from earlier runs are dropped.
for db in $(psql_admin -d postgres -c "select datname from pg_database where datname like 'rimeplan\\_t\\_%'"); do
  psql_admin -d postgres -c "drop database if exists \"$db\" with (force)" >/dev/null
done

results="$RIMEPLAN_RUN_DIR/results"; rm -rf "$results"; mkdir -p "$results"
status=0
# For working on one part: TEST_SUITES="unit integration e2e" (default all three) picks suites,
# TEST_FILTER passes file filters to vitest and Playwright. CI runs everything.
SUITES=" ${TEST_SUITES:-unit integration e2e} "
read -r -a FILTER <<<"${TEST_FILTER:-}"

if [[ "$SUITES" == *" unit "* ]]; then
  log "unit tests"
  node_modules/.bin/vitest run --project unit --reporter=default --reporter=json --outputFile.json="$results/unit.json" "${FILTER[@]}" || status=1
fi

if [[ "$SUITES" == *" integration "* ]]; then
  log "integration tests (PostgreSQL on 127.0.0.1:$PGPORT)"
  node_modules/.bin/vitest run --project integration --reporter=default --reporter=json --outputFile.json="$results/integration.json" "${FILTER[@]}" || status=1
fi

if [[ "$SUITES" != *" e2e "* ]]; then
  node_modules/.bin/tsx scripts/test-summary.ts "$results"
  exit $status
fi

log "browser tests: building the app"
E2E_DB="rimeplan_t_e2e_$RUN_ID"
psql_admin -d postgres -c "create database $E2E_DB template $TEMPLATE_DB owner $PG_APP_ROLE" >/dev/null
DATABASE_URL="$(pg_app_url "$E2E_DB")"; export DATABASE_URL
node_modules/.bin/tsx seeds/demo.ts || status=1
export AUTH_SECRET="test-secret-$(head -c 16 /dev/urandom | base64 | tr -d '\n/+=')"
export AUTH_TRUST_HOST=true APP_URL="http://localhost:$TEST_PORT" RIMEPLAN_DEV_MAIL=1
export SIGNIN_MAX_ATTEMPTS=5
if node_modules/.bin/next build >"$RIMEPLAN_RUN_DIR/build.log" 2>&1; then
  log "browser tests (chromium at /usr/bin/chromium)"
  node_modules/.bin/playwright test "${FILTER[@]}" 2>&1 | tee "$RIMEPLAN_RUN_DIR/e2e.log"
  [ "${PIPESTATUS[0]}" = 0 ] || status=1
  [ -f "$RIMEPLAN_RUN_DIR/e2e-report.json" ] && cp "$RIMEPLAN_RUN_DIR/e2e-report.json" "$results/e2e.json"
else
  tail -60 "$RIMEPLAN_RUN_DIR/build.log"; log "next build failed"; status=1
fi

node_modules/.bin/tsx scripts/test-summary.ts "$results"
exit $status
