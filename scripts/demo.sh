#!/usr/bin/env bash
# npm run demo: install what is missing, start PostgreSQL and the fake SMTP on loopback,
# migrate, seed the invented demo workspace, build, serve, and print the sign-ins.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export PORT="${PORT:-3000}"
export APP_URL="${APP_URL:-http://localhost:$PORT}"
export RIMEPLAN_DEV_MAIL=1
export AUTH_TRUST_HOST=true

ensure_apt postgresql postgresql-client
ensure_node_modules
pg_start
pg_create_db rimeplan
export DATABASE_URL="${DATABASE_URL:-$(pg_app_url rimeplan)}"
# The session-signing secret lives beside the cluster (outside the checkout): losing it signs
# everyone out. One made by earlier versions in .run/ is moved there.
if [ -z "${AUTH_SECRET:-}" ]; then
  secret_file="$(pg_dir)/auth-secret"
  if [ ! -s "$secret_file" ] && [ -s "$RIMEPLAN_RUN_DIR/auth-secret" ]; then
    (umask 077; cp "$RIMEPLAN_RUN_DIR/auth-secret" "$secret_file") && rm -f "$RIMEPLAN_RUN_DIR/auth-secret"
    log "moved the generated AUTH_SECRET from $RIMEPLAN_RUN_DIR to $secret_file"
  fi
  [ -s "$secret_file" ] || (umask 077; head -c 32 /dev/urandom | base64 | tr -d '\n' >"$secret_file")
  AUTH_SECRET="$(cat "$secret_file")"; export AUTH_SECRET
fi
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
