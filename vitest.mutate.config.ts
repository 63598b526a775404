import { defineConfig } from 'vitest/config';

// The `shared` project of vitest.config.ts alone (keep the two in step), for `npm run mutate` (stryker.config.json):
// pure code, no database, browser or jsdom.
export default defineConfig({
  // @shared/* from tsconfig.json, resolved in the sandbox Stryker copies the project into (so mutants are what runs).
  resolve: { tsconfigPaths: true },
  test: {
    name: 'shared',
    environment: 'node',
    include: ['tests/shared/**/*.test.ts'],
    setupFiles: ['tests/helpers/fast-check-seed.ts'],
    // Mutant switching loads each module once, so test files need not be isolated from one another (much faster).
    isolate: false,
    // Instrumented code under two busy workers runs several times slower than the plain suite.
    testTimeout: 60_000,
  },
});
