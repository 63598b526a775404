#!/usr/bin/env bash
# npm test: the same set-up with separate test databases and Redis, then type-check, build and every test suite.
# Ends with a plain "N passed, N failed" line read from Vitest's JSON report.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

REDIS_TEST_PORT="${REDIS_TEST_PORT:-63809}"
REDIS_STARTED_HERE=0
cleanup() {
  trap - INT TERM EXIT
  [ "$REDIS_STARTED_HERE" = 1 ] && stop_redis "$REDIS_TEST_PORT"
  [ "${PG_STARTED_HERE:-0}" = 1 ] && stop_postgres
  # Without this, a PostgreSQL that was already running (the test above is false) made a passing run exit 1.
  return 0
}
trap cleanup INT TERM EXIT

ensure_node_modules
ensure_postgres_running
ensure_database nestflow_test
ensure_database nestflow_e2e
if ensure_redis_running "$REDIS_TEST_PORT"; then REDIS_STARTED_HERE=1; fi
ensure_chromium
ensure_pdftotext

export NODE_ENV=test
export PG_PORT REDIS_TEST_PORT
export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/nestflow_test"
export E2E_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/nestflow_e2e"
export REDIS_URL="redis://127.0.0.1:$REDIS_TEST_PORT"

log "Type-checking"
npx tsc --noEmit -p tsconfig.json
log "Linting (eslint.config.js: typescript-eslint, React hooks, jsx-a11y, TanStack Query, tier boundaries)"
npx eslint --max-warnings=0 .
log "Building the web app and compiling the API and worker (dist/)"
npx vite build --logLevel warn
node --import tsx scripts/build/server.ts

mkdir -p artifacts
report="artifacts/vitest-report.json"
rm -f "$report"
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json="$report" "$@" || status=$?
if [ -f "$report" ]; then
  node -e 'const r=require(process.argv[1]);console.log(`${r.numPassedTests} passed, ${r.numFailedTests} failed`)' "$(pwd)/$report"
else
  echo "0 passed, 1 failed"
  status=1
fi
exit "$status"
