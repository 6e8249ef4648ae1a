import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@core-data': fileURLToPath(new URL('./core-data', import.meta.url)),
};

// The three vitest projects: pure unit tests (engine, catalogue, units), API tests against a
// real PostgreSQL database, and browser tests driving Debian's Chromium. `npm test` runs
// tests/run.ts, which runs six suites in turn — types (tsc), lint (ESLint and Prettier), unit,
// component (Angular's `ng test`), api (two shards side by side, a database each) and browser —
// preparing the databases and the browser for the last two.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 20_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
