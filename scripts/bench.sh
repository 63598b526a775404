#!/usr/bin/env bash
# npm run bench: speed figures (ratios and medians), printed, never a pass/fail gate. See DEVELOPERS.md.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"
ensure_node_modules
for f in bench/*.bench.ts; do
  log "Running $f"
  node --import tsx "$f"
done
