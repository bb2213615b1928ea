#!/usr/bin/env bash
# npm run demo: install what is missing, start PostgreSQL and the fake SMTP on loopback,
# migrate, seed the invented demo workspace, build, serve, and print the sign-ins.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export PORT="${PORT:-3000}"
export APP_URL="${APP_URL:-http://localhost:$PORT}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/rimeplan}"
export RIMEPLAN_DEV_MAIL=1
export AUTH_TRUST_HOST=true
if [ -z "${AUTH_SECRET:-}" ]; then
  [ -f "$RIMEPLAN_RUN_DIR/auth-secret" ] || head -c 32 /dev/urandom | base64 | tr -d '\n' >"$RIMEPLAN_RUN_DIR/auth-secret"
  AUTH_SECRET="$(cat "$RIMEPLAN_RUN_DIR/auth-secret")"; export AUTH_SECRET
fi

ensure_apt postgresql postgresql-client
ensure_node_modules
pg_start
pg_create_db rimeplan
node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx seeds/demo.ts
smtp_start
log "building the app"
node_modules/.bin/next build >"$RIMEPLAN_RUN_DIR/build.log" 2>&1 || { tail -40 "$RIMEPLAN_RUN_DIR/build.log"; exit 1; }
node_modules/.bin/tsx seeds/print-signins.ts "$APP_URL"
# The job worker (mail, exports, imports) runs beside the app and stops with it.
node_modules/.bin/tsx --conditions=react-server scripts/worker.ts >>"$RIMEPLAN_RUN_DIR/worker.log" 2>&1 &
WORKER_PID=$!
log "job worker started (log: $RIMEPLAN_RUN_DIR/worker.log)"
# Not exec: the trap stops the worker and the fake SMTP server when the app stops (Ctrl-C).
trap 'kill "$WORKER_PID" 2>/dev/null; smtp_stop' EXIT INT TERM
node_modules/.bin/tsx scripts/serve.ts
