import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Plugin } from 'vite';

/** What the API adds to index.html for a deep link (server/web/spa-page.ts reads it; DEVELOPERS.md "Web routing"). */
export interface RoutePreloads {
  /** Chunks every page asks for as soon as the entry runs (the session schema and zod). */
  always: string[];
  /** One entry per lazy page: its path as the router writes it (`infants/:id`) and the chunks it will load. */
  routes: { path: string; files: string[] }[];
}

export const ROUTE_PRELOADS_FILE = 'route-preloads.json';

// `page('caseload', () => import('./routes/caseload.route'), () => import('./routes/caseload.loader'))` and
// `{ path: 'sign-in', lazy: () => import('./routes/sign-in.route') }` in web/app/router.tsx.
const PAGE_CALL = /page\(\s*'([^']+)',\s*\(\)\s*=>\s*import\('([^']+)'\)(?:,\s*\(\)\s*=>\s*import\('([^']+)'\))?/g;
const LAZY_ROUTE = /path:\s*'([^'*]+)',\s*lazy:\s*\(\)\s*=>\s*import\('([^']+)'\)/g;

/** The router's lazy pages, each with its modules in the order the router asks for them (the loader first). */
export function readLazyRoutes(routerFile: string): { path: string; modules: string[] }[] {
  const source = readFileSync(routerFile, 'utf8');
  const dir = path.dirname(routerFile);
  const resolve = (spec: string) => path.resolve(dir, spec);
  const routes: { path: string; modules: string[] }[] = [];
  for (const [, route, component, loader] of source.matchAll(PAGE_CALL)) {
    routes.push({ path: route, modules: [loader, component].filter(Boolean).map(resolve) });
  }
  for (const [, route, component] of source.matchAll(LAZY_ROUTE)) routes.push({ path: route, modules: [resolve(component)] });
  return routes;
}

/**
 * Writes route-preloads.json beside the build: for every lazy page, the chunks it loads that the first load does not
 * already carry. Without them a phone on a slow line waits for the entry to download and run before it even asks
 * for the page's code; with `<link rel="modulepreload">` in the HTML they download beside the entry.
 */
export function routePreloads(options: { routerFile: string; always: string[] }): Plugin {
  return {
    name: 'nestflow-route-preloads',
    apply: 'build',
    generateBundle(_output, bundle) {
      const chunks = Object.values(bundle).filter((c) => c.type === 'chunk');
      const byFile = new Map(chunks.map((c) => [c.fileName, c]));
      // A page's module may share a chunk with others (the `app` group), so look modules up in every chunk.
      const byModule = new Map(chunks.flatMap((c) => c.moduleIds.map((id) => [stripExt(id), c] as const)));
      const closure = (start: string[], into = new Set<string>()) => {
        for (const file of start) {
          if (into.has(file) || !byFile.has(file)) continue;
          into.add(file);
          closure(byFile.get(file)!.imports, into);
        }
        return into;
      };
      const initial = closure(chunks.filter((c) => c.isEntry).map((c) => c.fileName));
      const filesFor = (modules: string[]) => {
        const starts = modules.map((m) => byModule.get(stripExt(m))?.fileName).filter((f): f is string => Boolean(f));
        if (starts.length !== modules.length) {
          this.error(`route-preloads: no chunk for ${modules.map((m) => path.relative(process.cwd(), m)).join(', ')}`);
        }
        return [...closure(starts)].filter((f) => !initial.has(f)).map((f) => `/${f}`);
      };
      const always = filesFor(options.always);
      const manifest: RoutePreloads = {
        always,
        routes: readLazyRoutes(options.routerFile).map((r) => ({
          path: r.path,
          files: filesFor(r.modules).filter((f) => !always.includes(f)),
        })),
      };
      this.emitFile({ type: 'asset', fileName: ROUTE_PRELOADS_FILE, source: JSON.stringify(manifest, null, 1) });
    },
  };
}

const stripExt = (id: string) => id.replace(/\?.*$/, '').replace(/\.(tsx?|jsx?)$/, '');
