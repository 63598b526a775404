#!/usr/bin/env bash
# Shared set-up steps for `npm start` and `npm test`: everything a fresh Debian 12 machine with only Node.js 20
# and npm needs, installed and started on loopback with data inside the repository (.data/, git-ignored).
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="${NESTFLOW_DATA_DIR:-$ROOT/.data}"
PG_PORT="${PG_PORT:-54329}"
REDIS_PORT="${REDIS_PORT:-63799}"

log() { printf '\033[1;36m[nestflow]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[nestflow]\033[0m %s\n' "$*" >&2; exit 1; }

as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    die "Need root to run: $* (install it yourself or run as root)"; fi
}

APT_UPDATED=0
apt_install() {
  if [ "$APT_UPDATED" = 0 ]; then
    log "apt-get update"
    as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
    APT_UPDATED=1
  fi
  log "Installing Debian packages: $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

ensure_node_modules() {
  cd "$ROOT"
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "Installing npm packages (npm ci)"
    CI=true npm ci --no-audit --no-fund
  fi
}

pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

ensure_postgres_installed() {
  if [ -z "$(pg_bin)" ] || [ ! -x "$(pg_bin)/initdb" ]; then apt_install postgresql; fi
  PGBIN="$(pg_bin)"
}

# PostgreSQL refuses to run as root, so as root the cluster runs as the `postgres` user. That user must be able
# to reach the data folder; a checkout under a root-only folder cannot, so fall back to a folder it can reach.
pg_run() { if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi; }

choose_pg_dir() {
  PG_DIR="$DATA_DIR/pg"
  mkdir -p "$DATA_DIR"
  if [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$DATA_DIR"; then
    local alt="/var/tmp/nestflow-$(printf '%s' "$ROOT" | sha1sum | cut -c1-10)"
    log "The postgres user cannot reach $DATA_DIR; keeping the database in $alt instead"
    PG_DIR="$alt/pg"
  fi
}

ensure_postgres_running() {
  ensure_postgres_installed
  choose_pg_dir
  local data="$PG_DIR/data" run="$PG_DIR/run"
  mkdir -p "$PG_DIR" "$run"
  if [ "$(id -u)" = 0 ]; then chown postgres:postgres "$PG_DIR" "$run"; fi
  if [ ! -f "$data/PG_VERSION" ]; then
    log "Creating the PostgreSQL cluster in $data"
    pg_run "$PGBIN/initdb" -D "$data" -U postgres -A trust -E UTF8 --locale=C.UTF-8 >/dev/null
    cat >> "$data/postgresql.conf" <<CONF
listen_addresses = '127.0.0.1'
port = $PG_PORT
unix_socket_directories = '$run'
fsync = ${PG_FSYNC:-off}
synchronous_commit = off
full_page_writes = off
max_connections = 200
CONF
  fi
  if pg_run "$PGBIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    PG_STARTED_HERE=0
  else
    log "Starting PostgreSQL on 127.0.0.1:$PG_PORT"
    pg_run "$PGBIN/pg_ctl" -D "$data" -l "$PG_DIR/postgres.log" -w -t 60 start >/dev/null
    PG_STARTED_HERE=1
  fi
  PG_DATA="$data"
}

ensure_database() {
  local db="$1"
  if ! "$PGBIN/psql" -h 127.0.0.1 -p "$PG_PORT" -U postgres -d postgres -tAc "select 1 from pg_database where datname='$db'" | grep -q 1; then
    log "Creating database $db"
    "$PGBIN/createdb" -h 127.0.0.1 -p "$PG_PORT" -U postgres "$db"
  fi
}

stop_postgres() { [ -n "${PG_DATA:-}" ] && pg_run "$PGBIN/pg_ctl" -D "$PG_DATA" -m fast -w stop >/dev/null 2>&1 || true; }

ensure_redis_running() {
  local port="$1" dir="$DATA_DIR/redis-$1"
  command -v redis-server >/dev/null || apt_install redis-server
  mkdir -p "$dir"
  if redis-cli -h 127.0.0.1 -p "$port" ping 2>/dev/null | grep -q PONG; then return 1; fi
  log "Starting Redis on 127.0.0.1:$port"
  # noeviction + append-only file: queued work must never be dropped silently (BullMQ production guide).
  redis-server --bind 127.0.0.1 --port "$port" --dir "$dir" --daemonize yes --pidfile "$dir/redis.pid" \
    --logfile "$dir/redis.log" --appendonly yes --maxmemory-policy noeviction --save "" >/dev/null
  for _ in $(seq 1 50); do redis-cli -h 127.0.0.1 -p "$port" ping 2>/dev/null | grep -q PONG && return 0; sleep 0.1; done
  die "Redis did not start on port $port; see $dir/redis.log"
}

stop_redis() { redis-cli -h 127.0.0.1 -p "$1" shutdown nosave >/dev/null 2>&1 || true; }

ensure_chromium() {
  command -v chromium >/dev/null || apt_install chromium
}

# The care-plan tests read the generated PDF back as text.
ensure_pdftotext() {
  command -v pdftotext >/dev/null || apt_install poppler-utils
}
