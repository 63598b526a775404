/** What `npm run build` compiles into dist/ (key: output path without .js; value: the TypeScript entry). */
export const ENTRY_POINTS = {
  'server/main': 'server/main.ts',
  'server/migrate': 'server/db/migrate.ts',
  'worker/main': 'worker/main.ts',
} as const;
