import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// Three projects: pure shared code, API/worker against real PostgreSQL + Redis, and web components in jsdom.
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { tsconfigPaths: true },
        test: {
          name: 'shared',
          environment: 'node',
          include: ['tests/shared/**/*.test.ts'],
          // Keep in step with vitest.mutate.config.ts, which runs this project alone for `npm run mutate`.
          setupFiles: ['tests/helpers/fast-check-seed.ts'],
        },
      },
      {
        resolve: { tsconfigPaths: true },
        test: {
          name: 'api',
          environment: 'node',
          include: ['tests/api/**/*.test.ts', 'tests/worker/**/*.test.ts'],
          globalSetup: ['tests/helpers/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        plugins: [react()],
        resolve: { tsconfigPaths: true },
        test: {
          name: 'web',
          environment: 'jsdom',
          include: ['tests/web/**/*.test.tsx'],
          setupFiles: ['tests/helpers/web-setup.ts'],
        },
      },
      {
        resolve: { tsconfigPaths: true },
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/helpers/e2e-setup.ts'],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
