import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = { '@': fileURLToPath(new URL('.', import.meta.url)) };

// Three projects: the pure core (no database), the server side (routes, data layer) that runs
// against a PostgreSQL database created fresh for the run by the global setup, and the fault tests.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'lib',
          include: ['tests/lib/**/*.test.ts'],
          testTimeout: 20000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'server',
          include: ['tests/api/**/*.test.ts', 'tests/db/**/*.test.ts', 'tests/browser/**/*.test.ts'],
          execArgv: ['--import', 'tsx'],
          globalSetup: ['tests/setup/global-db.ts'],
          fileParallelism: false,
          testTimeout: 30000,
          hookTimeout: 120000,
        },
      },
      {
        // Faults: a PostgreSQL cluster and app server of their own (stopped and started on purpose),
        // so the server project's database is never touched.
        resolve: { alias },
        test: {
          name: 'faults',
          include: ['tests/faults/**/*.test.ts'],
          execArgv: ['--import', 'tsx'],
          globalSetup: ['tests/setup/fault-env.ts'],
          fileParallelism: false,
          testTimeout: 60000,
          hookTimeout: 120000,
        },
      },
    ],
  },
});
