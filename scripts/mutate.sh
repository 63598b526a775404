#!/usr/bin/env bash
# npm run mutate: mutation testing of the clinical core (StrykerJS, stryker.config.json) over the pure `shared`
# tests only, then the per-file floor. Fails below 85 % overall (Stryker's thresholds.break) or 75 % for any file.
# Reports: reports/mutation/mutation.html and mutation.json (git-ignored).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

ensure_node_modules
rm -rf reports/mutation

status=0
log "Mutation testing shared/clinical, shared/schedule, shared/recordings and shared/reminders"
npx stryker run "$@" || status=$?
if [ -f reports/mutation/mutation.json ]; then
  node --import tsx scripts/mutation-scores.ts reports/mutation/mutation.json --file-floor 75 --overall-floor 85 || status=1
else
  status=1
fi
[ "$status" = 0 ] && log "Mutation scores meet the floors" || log "Mutation testing failed (see above)"
exit "$status"
