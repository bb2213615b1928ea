#!/usr/bin/env bash
# npm run bench:api — a bounded HTTP load test on loopback (never part of npm test).
# Starts PostgreSQL (the test cluster, a fresh rimeplan_bench database with the demo seed),
# builds the app, starts production servers (scripts/serve.ts) and runs scripts/bench-api.ts
# against one instance, then against two on the same database. Settings:
#   BENCH_INSTANCES="1 2"   instance counts to measure, in order
#   BENCH_PORT=3280         first instance's port; the second listens on BENCH_PORT+10
#   BENCH_SECONDS=10        per case; BENCH_CONNECTIONS="10 50"; BENCH_RATE=200 (paced read)
#   BENCH_SKIP_BUILD=1      reuse the last `next build`
#   BENCH_PGPORT            the cluster's port (default TEST_PGPORT, else 54339)
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export PGPORT="${BENCH_PGPORT:-${TEST_PGPORT:-54339}}"
export RIMEPLAN_PG_DIR="${RIMEPLAN_TEST_PG_DIR:-}"
[ -n "$RIMEPLAN_PG_DIR" ] || unset RIMEPLAN_PG_DIR
if [ -z "${RIMEPLAN_PG_DIR:-}" ]; then export RIMEPLAN_PG_DIR="$(pg_dir)-test"; fi
export RIMEPLAN_RUN_DIR="$ROOT/.run/bench"
mkdir -p "$RIMEPLAN_RUN_DIR"
PORT_A="${BENCH_PORT:-3280}"
PORT_B=$((PORT_A + 10))
INSTANCES="${BENCH_INSTANCES:-1 2}"

ensure_apt postgresql postgresql-client
ensure_node_modules
pg_start
DB=rimeplan_bench
psql_admin -d postgres -c "drop database if exists $DB with (force)" >/dev/null
psql_admin -d postgres -c "create database $DB" >/dev/null
export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/$DB"
node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx seeds/demo.ts

export NODE_ENV=production AUTH_TRUST_HOST=true APP_URL="http://localhost:$PORT_A"
export AUTH_SECRET="bench-$(head -c 24 /dev/urandom | base64 | tr -d '\n/+=')"
export LOG_LEVEL="${BENCH_LOG_LEVEL:-info}"   # the production default: one line per request
if [ "${BENCH_SKIP_BUILD:-0}" != 1 ] || [ ! -f .next/BUILD_ID ]; then
  log "building the app (next build)"
  node_modules/.bin/next build >"$RIMEPLAN_RUN_DIR/build.log" 2>&1 || { tail -40 "$RIMEPLAN_RUN_DIR/build.log"; exit 1; }
fi

PIDS=()
stop_all() { for p in "${PIDS[@]}"; do kill "$p" 2>/dev/null || true; done; }
trap stop_all EXIT INT TERM

start_instance() {
  local port="$1"
  PORT="$port" node --import tsx scripts/serve.ts >"$RIMEPLAN_RUN_DIR/server-$port.log" 2>&1 &
  PIDS+=("$!")
  for _ in $(seq 1 120); do
    curl -fsS "http://localhost:$port/api/v1/health" >/dev/null 2>&1 && { log "instance on http://localhost:$port (pid $!)"; return; }
    sleep 0.5
  done
  log "instance on port $port did not start; see $RIMEPLAN_RUN_DIR/server-$port.log"; exit 1
}

log "machine: $(nproc) cores, $(uptime | sed 's/.*load average/load average/')"
status=0
started=0
for n in $INSTANCES; do
  while [ "$started" -lt "$n" ]; do
    [ "$started" = 0 ] && start_instance "$PORT_A" || start_instance "$PORT_B"
    started=$((started + 1))
  done
  urls="http://localhost:$PORT_A"; [ "$n" -ge 2 ] && urls="$urls,http://localhost:$PORT_B"
  log "load test against $n instance(s); $(uptime | sed 's/.*load average/load average/')"
  BENCH_URLS="$urls" BENCH_SERVER_PIDS="${PIDS[*]}" BENCH_DB="$DB" BENCH_JSON="$RIMEPLAN_RUN_DIR/figures-$n.json" node_modules/.bin/tsx scripts/bench-api.ts || status=1
  log "after: $(uptime | sed 's/.*load average/load average/')"
done
exit $status
