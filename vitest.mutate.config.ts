import { defineConfig } from 'vitest/config';

// The `shared` project of vitest.config.ts alone (keep the two in step), for `npm run mutate` (stryker.config.json):
// pure code, no database, browser or jsdom.
export default defineConfig({
  test: {
    name: 'shared',
    environment: 'node',
    include: ['tests/shared/**/*.test.ts'],
    setupFiles: ['tests/helpers/fast-check-seed.ts'],
    isolate: false,
  },
});
