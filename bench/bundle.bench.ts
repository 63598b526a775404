// docs/service-targets.md P7: initial JS (the entry and everything it imports statically, gzip) against 130 KiB, and the
// largest lazy route chunk (gzip) against 60 KiB. Reads the Vite manifest when the build wrote one (scripts/bench.sh
// builds with --manifest; vite.config.ts writes none), else the entry script and modulepreload links of index.html.
// Prints figures only.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

const DIST = path.resolve(process.env.BENCH_WEB_DIST ?? 'dist/web');
const INITIAL_BUDGET_KIB = 130;
const LAZY_BUDGET_KIB = 60;
const manifestPath = path.join(DIST, '.vite', 'manifest.json');

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
type Manifest = Record<string, ManifestChunk>;

interface Sizes {
  raw: number;
  gzip: number;
}

// scripts/bench.sh builds once for every benchmark; run on its own, this file builds first.
if (process.env.BENCH_WEB_BUILT !== '1') {
  const built = spawnSync('npx', ['vite', 'build', '--manifest', '--outDir', DIST, '--emptyOutDir'], { stdio: ['ignore', 'ignore', 'inherit'] });
  if (built.status !== 0) throw new Error(`vite build exited ${built.status}`);
}

const sizeCache = new Map<string, Sizes>();
function sizeOf(file: string): Sizes {
  let s = sizeCache.get(file);
  if (!s) {
    const bytes = readFileSync(path.join(DIST, file));
    // Default zlib level (6), what a web server's gzip usually sends.
    s = { raw: bytes.length, gzip: gzipSync(bytes).length };
    sizeCache.set(file, s);
  }
  return s;
}
const kib = (n: number) => (n / 1024).toFixed(1);
const sum = (files: Iterable<string>) =>
  [...files].reduce((t, f) => ({ raw: t.raw + sizeOf(f).raw, gzip: t.gzip + sizeOf(f).gzip }), { raw: 0, gzip: 0 });

/** The files a key loads before it runs: itself and its static imports, transitively. */
function staticClosure(manifest: Manifest, key: string, into = new Set<string>()): Set<string> {
  const chunk = manifest[key];
  if (!chunk || into.has(chunk.file)) return into;
  into.add(chunk.file);
  for (const dep of chunk.imports ?? []) staticClosure(manifest, dep, into);
  return into;
}

interface Layout {
  source: string;
  graph: boolean; // whether each lazy chunk's own static imports are known (only the manifest says)
  initial: Set<string>;
  lazy: { file: string; route: string | null; adds: Set<string> }[];
}

function fromManifest(manifest: Manifest): Layout {
  const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
  if (!entryKey) throw new Error('the manifest names no entry');
  const initial = staticClosure(manifest, entryKey);
  const lazy = Object.entries(manifest)
    .filter(([, c]) => c.file.endsWith('.js') && !initial.has(c.file))
    .map(([key, c]) => {
      const route = c.isDynamicEntry && c.src && /\.route\.tsx?$/.test(c.src) ? path.basename(c.src).replace(/\.tsx?$/, '') : null;
      // What opening this route downloads on top of the first load.
      const adds = new Set([...staticClosure(manifest, key)].filter((f) => !initial.has(f)));
      return { file: c.file, route, adds };
    });
  return { source: path.relative(process.cwd(), manifestPath), graph: true, initial, lazy };
}

function fromIndexHtml(): Layout {
  const html = readFileSync(path.join(DIST, 'index.html'), 'utf8');
  const links = [...html.matchAll(/<(?:script[^>]*type="module"[^>]*src|link[^>]*rel="modulepreload"[^>]*href)="\/([^"]+\.js)"/g)].map((m) => m[1]);
  const initial = new Set(links);
  const lazy = readdirSync(path.join(DIST, 'assets'))
    .map((f) => `assets/${f}`)
    .filter((f) => f.endsWith('.js') && !initial.has(f))
    .map((file) => {
      const m = /assets\/(.+\.route)-[^/]+\.js$/.exec(file);
      return { file, route: m ? m[1] : null, adds: new Set([file]) };
    });
  return { source: `${path.relative(process.cwd(), path.join(DIST, 'index.html'))} (no manifest)`, graph: false, initial, lazy };
}

const layout = existsSync(manifestPath) ? fromManifest(JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest) : fromIndexHtml();
const initial = sum(layout.initial);
const lazyByGzip = [...layout.lazy].sort((a, b) => sizeOf(b.file).gzip - sizeOf(a.file).gzip);
const routeChunks = lazyByGzip.filter((l) => l.route);
const largestRoute = routeChunks[0];
const largestLazy = lazyByGzip[0];
const heaviestVisit = [...routeChunks].sort((a, b) => sum(b.adds).gzip - sum(a.adds).gzip)[0];
const allJs = [...layout.initial, ...layout.lazy.map((l) => l.file)].sort((a, b) => sizeOf(b).gzip - sizeOf(a).gzip);
const css = readdirSync(path.join(DIST, 'assets')).filter((f) => f.endsWith('.css')).map((f) => `assets/${f}`);

console.log(`web bundle (P7), from ${layout.source}; gzip = node:zlib default level`);
console.log(`  initial JS             ${kib(initial.gzip)} KiB gzip (${kib(initial.raw)} KiB raw) in ${layout.initial.size} files   target ≤ ${INITIAL_BUDGET_KIB} KiB`);
if (largestRoute) {
  console.log(`  largest route chunk    ${kib(sizeOf(largestRoute.file).gzip)} KiB gzip  ${largestRoute.route}   target ≤ ${LAZY_BUDGET_KIB} KiB`);
}
if (largestLazy && largestLazy !== largestRoute) {
  console.log(`  largest lazy chunk     ${kib(sizeOf(largestLazy.file).gzip)} KiB gzip  ${largestLazy.file} (not a route module; a route loads it)`);
}
if (heaviestVisit && layout.graph) {
  console.log(`  heaviest first visit   ${kib(sum(heaviestVisit.adds).gzip)} KiB gzip  ${heaviestVisit.route} with ${heaviestVisit.adds.size - 1} shared chunk(s) not in the first load`);
}
console.log(`  CSS (not in the JS budget) ${kib(sum(css).gzip)} KiB gzip; ${layout.lazy.length} lazy JS chunks, ${routeChunks.length} of them route modules`);
console.log('  top 5 JS chunks by gzip:');
for (const f of allJs.slice(0, 5)) {
  const s = sizeOf(f);
  const kind = layout.initial.has(f) ? 'initial' : 'lazy';
  console.log(`    ${kib(s.gzip).padStart(6)} KiB gzip ${kib(s.raw).padStart(7)} KiB raw  ${kind.padEnd(7)} ${f}`);
}
