#!/usr/bin/env bash
# npm start: set up everything on this machine, then run the API (serving the web app), the worker and the local
# fake mail/SMS servers until Ctrl-C, which stops all that this script started.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

PIDS=()
REDIS_STARTED_HERE=0
cleanup() {
  trap - INT TERM EXIT
  log "Stopping Nestflow"
  for pid in "${PIDS[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for pid in "${PIDS[@]}"; do wait "$pid" 2>/dev/null || true; done
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

log "Applying database migrations"
node --import tsx server/db/migrate.ts
if [ "$NODE_ENV" != production ]; then
  log "Loading the demo scenario"
  node --import tsx seed/main.ts
fi
log "Building the web app"
npx vite build --logLevel warn

node --import tsx server/main.ts & PIDS+=($!)
node --import tsx worker/main.ts & PIDS+=($!)
for f in fakes/*/main.ts; do [ -f "$f" ] && { node --import tsx "$f" & PIDS+=($!); }; done

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
wait -n "${PIDS[@]}" || status=$?
log "A Nestflow process ended (exit $status); stopping the rest"
exit "$status"
