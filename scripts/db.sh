#!/usr/bin/env bash
# npm run db:start | db:stop | db:migrate | db:backup [file] | db:restore <file> [database]
# `bash scripts/db.sh url` prints the app's DATABASE_URL (for `npm run dev`).
# With DATABASE_URL set (an external PostgreSQL), backup and restore work on that database and
# start/stop/migrate leave the local cluster alone except for migrate.
source "$(dirname "$0")/lib.sh"
export DATABASE_NAME="${DATABASE_NAME:-rimeplan}"
external="${DATABASE_URL:+1}"
app_url() { if [ -n "$external" ]; then echo "$DATABASE_URL"; else pg_app_url "$DATABASE_NAME"; fi; }
# The same server and role as app_url, another database.
url_for_db() { node -e 'const u = new URL(process.argv[1]); u.pathname = "/" + process.argv[2]; console.log(u.toString())' "$(app_url)" "$1"; }
cmd="${1:-}"; shift || true
case "$cmd" in
  start) pg_start; pg_create_db "$DATABASE_NAME" ;;
  stop) pg_stop ;;
  url) app_url ;;
  migrate)
    if [ -z "$external" ]; then pg_start; pg_create_db "$DATABASE_NAME"; fi
    (cd "$ROOT" && DATABASE_URL="$(app_url)" node_modules/.bin/tsx scripts/migrate.ts) ;;
  backup)
    mkdir -p "$ROOT/backups"
    out="${1:-$ROOT/backups/rimeplan-$(date -u +%Y%m%dT%H%M%SZ).dump}"
    url="$(app_url)"
    pg_dump --format=custom --no-owner --dbname="$url" --file="$out"
    log "backup written to $out" ;;
  restore)
    file="${1:?usage: db:restore <file> [database]}"; target="${2:-}"
    if [ -n "$target" ]; then url="$(url_for_db "$target")"; else url="$(app_url)"; target="$(node -e 'console.log(new URL(process.argv[1]).pathname.slice(1))' "$url")"; fi
    [ -n "$external" ] || pg_create_db "$target"
    # The job queue's schema uses partitioned tables, which pg_restore --clean cannot drop piece
    # by piece ("cannot drop inherited constraint"); drop it whole first. The dump brings it back
    # (or the queue recreates it at its next start, for a dump taken before it existed).
    psql "$url" -v ON_ERROR_STOP=1 -qAt -c "drop schema if exists pgboss cascade" >/dev/null
    # --no-owner: the restored objects belong to the role restoring them (the app's role).
    pg_restore --clean --if-exists --no-owner --exit-on-error --dbname="$url" "$file"
    log "restored $file into database $target" ;;
  *) echo "usage: scripts/db.sh start|stop|url|migrate|backup [file]|restore <file> [database]" >&2; exit 2 ;;
esac
