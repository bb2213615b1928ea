#!/usr/bin/env bash
# npm run db:start | db:stop | db:migrate | db:backup [file] | db:restore <file> [database]
source "$(dirname "$0")/lib.sh"
export DATABASE_NAME="${DATABASE_NAME:-rimeplan}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/$DATABASE_NAME}"
cmd="${1:-}"; shift || true
case "$cmd" in
  start) pg_start; pg_create_db "$DATABASE_NAME" ;;
  stop) pg_stop ;;
  migrate) pg_start; pg_create_db "$DATABASE_NAME"; (cd "$ROOT" && node_modules/.bin/tsx scripts/migrate.ts) ;;
  backup)
    mkdir -p "$ROOT/backups"
    out="${1:-$ROOT/backups/rimeplan-$(date -u +%Y%m%dT%H%M%SZ).dump}"
    pg_dump --format=custom --no-owner --dbname="$DATABASE_URL" --file="$out"
    log "backup written to $out" ;;
  restore)
    file="${1:?usage: db:restore <file> [database]}"; target="${2:-$DATABASE_NAME}"
    pg_create_db "$target"
    pg_restore --clean --if-exists --no-owner --exit-on-error \
      --dbname="postgres://postgres@127.0.0.1:$PGPORT/$target" "$file"
    log "restored $file into database $target" ;;
  *) echo "usage: scripts/db.sh start|stop|migrate|backup [file]|restore <file> [database]" >&2; exit 2 ;;
esac
