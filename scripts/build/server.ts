// npm run build (after the web app): compiles the API, the worker and the migration step to JavaScript in dist/,
// so production runs `node dist/...` with no TypeScript tooling. esbuild (the same compiler tsx uses in
// development) bundles our own code; packages stay in node_modules.
import { build } from 'esbuild';
import { cpSync, rmSync } from 'node:fs';
import path from 'node:path';
import { ENTRY_POINTS } from './entry-points';

const root = path.resolve(import.meta.dirname, '../..');
const out = path.join(root, 'dist');
for (const dir of ['server', 'worker']) rmSync(path.join(out, dir), { recursive: true, force: true });

await build({
  absWorkingDir: root,
  entryPoints: ENTRY_POINTS,
  outdir: out,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  sourcemap: true,
  tsconfig: path.join(root, 'tsconfig.json'),
  logLevel: 'warning',
  // Stack traces in the log point at the TypeScript lines.
  banner: { js: '// Built by scripts/build/server.ts from the TypeScript sources; do not edit.' },
});

// Files read at run time beside the code that reads them (e-mail templates, found relative to the bundle).
for (const dir of ['server', 'worker']) cpSync(path.join(root, 'server/notifications/templates'), path.join(out, dir, 'templates'), { recursive: true });
console.log(`Compiled ${Object.keys(ENTRY_POINTS).map((k) => `dist/${k}.js`).join(', ')}`);
