#!/usr/bin/env bash
# Shared shell helpers for the demo and test scripts: environment defaults, Debian packages,
# the private PostgreSQL cluster on loopback and the fake SMTP server.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1

# Defaults; any of these may be set in the environment beforehand.
export PGPORT="${PGPORT:-54329}"
export RIMEPLAN_RUN_DIR="${RIMEPLAN_RUN_DIR:-$ROOT/.run}"
export SMTP_PORT="${SMTP_PORT:-2525}"
export MAIL_CATCHER_DIR="${MAIL_CATCHER_DIR:-$RIMEPLAN_RUN_DIR/mail}"
mkdir -p "$RIMEPLAN_RUN_DIR"

log() { printf '\033[1m[rimeplan]\033[0m %s\n' "$*"; }

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

# Install Debian packages that are missing (postgresql, chromium …).
ensure_apt() {
  local missing=()
  for pkg in "$@"; do
    dpkg -s "$pkg" >/dev/null 2>&1 || missing+=("$pkg")
  done
  if [ "${#missing[@]}" -gt 0 ]; then
    log "installing Debian packages: ${missing[*]}"
    as_root apt-get update -qq
    DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq "${missing[@]}" >/dev/null
  fi
}

ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules/.bin" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    log "installing npm dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund)
  fi
}

pg_bin() { ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1; }

# The cluster's folder: inside the checkout (.pgdata, ignored by git) when the postgres user
# can reach it, otherwise a folder under /var/tmp keyed by the checkout path (a checkout
# under a mode-700 home is unreachable for the postgres user).
pg_dir() {
  if [ -n "${RIMEPLAN_PG_DIR:-}" ]; then echo "$RIMEPLAN_PG_DIR"; return; fi
  if runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
    echo "$ROOT/.pgdata"
  else
    echo "/var/tmp/rimeplan-pg-$(printf '%s' "$ROOT" | md5sum | cut -c1-10)"
  fi
}

pg_start() {
  ensure_apt postgresql postgresql-client
  # Debian starts its own cluster on 5432 after install; ours is private, so leave theirs alone.
  local bin dir sock
  bin="$(pg_bin)"; dir="$(pg_dir)"; sock="/tmp/rimeplan-pg-$PGPORT"
  if [ "$(id -u)" = 0 ]; then
    install -d -o postgres -g postgres -m 700 "$dir"
    install -d -o postgres -g postgres -m 755 "$sock"
  else
    mkdir -p "$dir" "$sock"
  fi
  local run=(); [ "$(id -u)" = 0 ] && run=(runuser -u postgres --)
  if [ ! -f "$dir/data/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $dir"
    "${run[@]}" "$bin/initdb" -D "$dir/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if "${run[@]}" "$bin/pg_ctl" -D "$dir/data" status >/dev/null 2>&1; then
    log "PostgreSQL already running on 127.0.0.1:$PGPORT"
  else
    "${run[@]}" "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 60 \
      -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $sock -c fsync=off -c max_connections=200" start >/dev/null
    log "PostgreSQL started on 127.0.0.1:$PGPORT (log: $dir/server.log)"
  fi
}

pg_stop() {
  local bin dir run=(); bin="$(pg_bin)"; dir="$(pg_dir)"
  [ "$(id -u)" = 0 ] && run=(runuser -u postgres --)
  "${run[@]}" "$bin/pg_ctl" -D "$dir/data" -m fast stop >/dev/null 2>&1 || true
}

psql_admin() { psql -h 127.0.0.1 -p "$PGPORT" -U postgres -v ON_ERROR_STOP=1 -qAt "$@"; }

pg_create_db() {
  local name="$1"
  if [ -z "$(psql_admin -d postgres -c "select 1 from pg_database where datname='$name'")" ]; then
    psql_admin -d postgres -c "create database \"$name\"" >/dev/null
    log "created database $name"
  fi
}

# Fake SMTP server on loopback; caught messages land as JSON files in $MAIL_CATCHER_DIR.
smtp_start() {
  mkdir -p "$MAIL_CATCHER_DIR"
  if (exec 3<>"/dev/tcp/127.0.0.1/$SMTP_PORT") 2>/dev/null; then
    log "fake SMTP already listening on 127.0.0.1:$SMTP_PORT"
    return
  fi
  # The server writes its own pid (SMTP_PID_FILE) once listening, so smtp_stop ends it.
  (cd "$ROOT" && SMTP_PID_FILE="$RIMEPLAN_RUN_DIR/smtp.pid" nohup node --import tsx scripts/fake-smtp.ts >"$RIMEPLAN_RUN_DIR/smtp.log" 2>&1 &)
  for _ in $(seq 1 50); do
    (exec 3<>"/dev/tcp/127.0.0.1/$SMTP_PORT") 2>/dev/null && { log "fake SMTP on 127.0.0.1:$SMTP_PORT, mail in $MAIL_CATCHER_DIR"; return; }
    sleep 0.2
  done
  log "fake SMTP did not start; see $RIMEPLAN_RUN_DIR/smtp.log"; exit 1
}

smtp_stop() {
  [ -f "$RIMEPLAN_RUN_DIR/smtp.pid" ] && kill "$(cat "$RIMEPLAN_RUN_DIR/smtp.pid")" 2>/dev/null || true
  rm -f "$RIMEPLAN_RUN_DIR/smtp.pid"
}
