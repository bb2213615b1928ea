#!/usr/bin/env bash
# npm run bench:canvas — the canvas benchmark against a production build: starts the demo's
# PostgreSQL, migrates and seeds, builds, serves on BENCH_PORT (default 3280), runs
# tests/e2e/canvas-bench.ts (prints the edit-to-screen median over 20 edits on ~300 nodes,
# and pan/zoom frame times), then stops the server.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
export BENCH_PORT="${BENCH_PORT:-3280}"
export AUTH_SECRET="${AUTH_SECRET:-bench-secret-$(head -c 12 /dev/urandom | base64 | tr -d '/+=')}"
export AUTH_TRUST_HOST=true APP_URL="http://localhost:$BENCH_PORT" LOG_LEVEL=warn
ensure_apt postgresql postgresql-client chromium
ensure_node_modules
pg_start
pg_create_db rimeplan
export DATABASE_URL="${DATABASE_URL:-$(pg_app_url rimeplan)}"
node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx seeds/demo.ts
if [ "${SKIP_BUILD:-0}" != 1 ]; then
  log "building the app"
  node_modules/.bin/next build >"$RIMEPLAN_RUN_DIR/bench-build.log" 2>&1 || { tail -40 "$RIMEPLAN_RUN_DIR/bench-build.log"; exit 1; }
fi
node_modules/.bin/next start -p "$BENCH_PORT" >"$RIMEPLAN_RUN_DIR/bench-server.log" 2>&1 &
server=$!
trap 'kill $server 2>/dev/null' EXIT
for _ in $(seq 1 120); do curl -sf "http://localhost:$BENCH_PORT/api/v1/health" >/dev/null && break; sleep 0.5; done
BASE="http://localhost:$BENCH_PORT" node_modules/.bin/tsx tests/e2e/canvas-bench.ts
