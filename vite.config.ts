import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';
import { routePreloads } from './scripts/build/vite-route-preloads.ts';

const root = fileURLToPath(new URL('.', import.meta.url));

// Libraries that change rarely get their own chunks so a release of app code does not bust their cache.
const vendorGroups = [
  { name: 'react', test: /node_modules[\\/](react|react-dom|scheduler)[\\/]/, priority: 5 },
  { name: 'router', test: /node_modules[\\/](react-router|react-router-dom|cookie|set-cookie-parser)[\\/]/, priority: 4 },
  { name: 'query', test: /node_modules[\\/]@tanstack[\\/](query-core|react-query)[\\/]/, priority: 4 },
  { name: 'table', test: /node_modules[\\/]@tanstack[\\/](table-core|react-table|react-store|store)[\\/]/, priority: 4 },
  { name: 'forms', test: /node_modules[\\/](react-hook-form|@hookform)[\\/]/, priority: 4 },
  { name: 'casl', test: /node_modules[\\/]@casl[\\/]/, priority: 4 },
  { name: 'zod', test: /node_modules[\\/]zod[\\/]/, priority: 4 },
  { name: 'phone', test: /node_modules[\\/]libphonenumber-js[\\/]/, priority: 4 },
  { name: 'charts', test: /node_modules[\\/]uplot[\\/]/, priority: 4 },
];

// Libraries only some pages need; a module that reaches one of them, however indirectly, stays with those pages.
const PAGE_LIBRARIES = /^(@tanstack\/react-table|react-hook-form|@hookform\/|libphonenumber-js|uplot|csv-parse)/;
const IMPORTS = /(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;
const reaches = new Map<string, boolean>();

/** Whether a source file imports one of PAGE_LIBRARIES, directly or through the app's own files (type imports aside). */
function reachesPageLibrary(file: string): boolean {
  const known = reaches.get(file);
  if (known !== undefined) return known;
  reaches.set(file, false); // an import cycle adds nothing new
  let found = false;
  for (const [statement, fromSpec, dynamicSpec] of readFileSync(file, 'utf8').matchAll(IMPORTS)) {
    const spec = fromSpec ?? dynamicSpec;
    if (/^(import|export)\s+type\s/.test(statement)) continue;
    if (PAGE_LIBRARIES.test(spec)) found = true;
    else if (spec.startsWith('.') || spec.startsWith('@shared/')) {
      const base = spec.startsWith('@shared/') ? path.join(root, 'shared', spec.slice(8)) : path.resolve(path.dirname(file), spec);
      const target = ['.ts', '.tsx', '/index.ts'].map((ext) => base + ext).find(existsSync);
      if (target && reachesPageLibrary(target)) found = true;
    }
    if (found) break;
  }
  reaches.set(file, found);
  return found;
}

// Small modules many pages share (UI kit, web helpers, query options, shared schemas and clinical code) as one chunk:
// dozens of chunks of a few hundred bytes would queue on HTTP/1.1's six connections, a round trip apiece on a
// slow phone line.
const SHARED_APP_CODE = /[\\/](web[\\/](components[\\/]ui|lib|features[\\/][^\\/]+[\\/]api)|shared)[\\/][^?]*\.tsx?$/;
const appGroups = [
  // The first load's own code stays in the entry's chunks, so the group below never pulls it into a lazy one.
  { name: 'shell', tags: ['$initial' as const], test: /[\\/](web|shared)[\\/]/, priority: 3 },
  { name: 'app', test: (id: string) => SHARED_APP_CODE.test(id) && !reachesPageLibrary(id), minShareCount: 2, priority: 2 },
];

export default defineConfig({
  root,
  publicDir: 'web/public',
  plugins: [
    react(),
    tailwindcss(),
    // route-preloads.json: each deep link's chunks, which the API names in the page's HTML (server/web/spa-page.ts).
    routePreloads({ routerFile: path.join(root, 'web/app/router.tsx'), always: [path.join(root, 'shared/schemas/session.ts')] }),
    // Brotli (and gzip at its best level) once at build time, served as they are by the API (server/app.ts): brotli
    // takes about an eighth off the first load's bytes, too slow to do per request at its best level.
    compression({ algorithms: ['brotliCompress', 'gzip'], include: /\.(js|css|svg)$/ }),
  ],
  resolve: { tsconfigPaths: true },
  server: {
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: 'http://127.0.0.1:3000' }, '/supplier-api': { target: 'http://127.0.0.1:3000' } },
  },
  build: {
    outDir: 'dist/web',
    emptyOutDir: true,
    rolldownOptions: {
      output: { codeSplitting: { groups: [...vendorGroups, ...appGroups] } },
    },
  },
});
