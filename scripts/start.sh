#!/usr/bin/env bash
# npm start: set up everything on this machine, then run the API (serving the web app), the worker and the local
# fake mail/SMS servers until Ctrl-C, which stops all that this script started. A child that crashes is restarted
# with backoff by scripts/supervisor (everything stops only on Ctrl-C or 5 crashes of one child within 60 s).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

SUPERVISOR=""
REDIS_STARTED_HERE=0
cleanup() {
  trap - INT TERM EXIT
  log "Stopping Nestflow"
  if [ -n "$SUPERVISOR" ]; then kill -TERM "$SUPERVISOR" 2>/dev/null || true; wait "$SUPERVISOR" 2>/dev/null || true; fi
  [ "$REDIS_STARTED_HERE" = 1 ] && stop_redis "$REDIS_PORT"
  [ "${PG_STARTED_HERE:-0}" = 1 ] && stop_postgres
  log "Stopped"
}
trap 'cleanup; exit 0' INT TERM
trap cleanup EXIT

ensure_node_modules
ensure_postgres_running
ensure_database "${PG_DATABASE:-nestflow}"
if ensure_redis_running "$REDIS_PORT"; then REDIS_STARTED_HERE=1; fi

export NODE_ENV="${NODE_ENV:-development}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:$PG_PORT/${PG_DATABASE:-nestflow}}"
export REDIS_URL="${REDIS_URL:-redis://127.0.0.1:$REDIS_PORT}"
export PORT="${PORT:-3000}"
# The fake SMS server forwards replies (STOP) to the API's webhook, signed like the hosted service signs them.
export INBOUND_WEBHOOK_URL="${INBOUND_WEBHOOK_URL:-http://127.0.0.1:$PORT/api/webhooks/sms}"
# What the fakes received is kept on disk, so a restarted fake still lists (and finds) it.
export FAKE_INBOX_DIR="${FAKE_INBOX_DIR:-$DATA_DIR/fakes}"
# The worker and API derive where to send from FAKE_SMTP_PORT / FAKE_SMS_PORT / FAKE_MAIL_HTTP_PORT (server/env.ts).

log "Applying database migrations"
node --import tsx server/db/migrate.ts
if [ "$NODE_ENV" != production ]; then
  log "Loading the demo scenario"
  node --import tsx seed/main.ts
fi
log "Building the web app"
npx vite build --logLevel warn

node --import tsx scripts/supervisor/main.ts & SUPERVISOR=$!

for _ in $(seq 1 100); do
  node -e 'fetch(process.argv[1]).then((r) => process.exit(r.ok ? 0 : 1), () => process.exit(1))' \
    "http://127.0.0.1:$PORT/api/health" && break
  sleep 0.3
done
cat <<MSG

  Nestflow is running at http://127.0.0.1:$PORT
MSG
[ "$NODE_ENV" != production ] && node --import tsx seed/print-sign-ins.ts
echo "  Press Ctrl-C to stop."
echo

status=0
wait "$SUPERVISOR" || status=$?
SUPERVISOR=""
if [ "$status" = 0 ]; then log "The process supervisor stopped its children"; else
  log "The process supervisor ended (exit $status): a child kept crashing; stopping the rest"; fi
exit "$status"
