#!/usr/bin/env bash
# npm run bench: speed figures (ratios and medians), printed, never a pass/fail gate. See DEVELOPERS.md.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"
ensure_node_modules
# One production build for the bundle (P7) and page-load (P8) benchmarks; the manifest lets P7 follow the imports.
log "Building the web app (vite build --manifest)"
npx vite build --manifest --outDir "${BENCH_WEB_DIST:-dist/web}" --emptyOutDir >/dev/null
export BENCH_WEB_BUILT=1
for f in bench/*.bench.ts; do
  log "Running $f"
  node --expose-gc --import tsx "$f"
done
