import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// This file lives in tests/; paths are relative to the repository root.
const root = fileURLToPath(new URL('..', import.meta.url));
const alias = { '@': root };

// Three projects: the pure core (no database), the server side (routes, data layer) that runs
// against a PostgreSQL database created fresh for the run by the global setup, and the fault tests.
export default defineConfig({
  root,
  resolve: { alias },
  test: {
    projects: [
      {
        root,
        resolve: { alias },
        test: {
          name: 'lib',
          include: ['tests/lib/**/*.test.ts'],
          testTimeout: 20000,
        },
      },
      {
        root,
        resolve: { alias },
        test: {
          name: 'server',
          include: ['tests/api/**/*.test.ts', 'tests/db/**/*.test.ts', 'tests/browser/**/*.test.ts'],
          execArgv: ['--import', 'tsx'],
          globalSetup: ['tests/setup/global-db.ts'],
          fileParallelism: false,
          testTimeout: 30000,
          hookTimeout: 120000,
          // A poll waits on the app server's answer to a click; on a loaded two-core machine that
          // can take longer than the 1 s default without anything being wrong.
          expect: { poll: { timeout: 10000 } },
        },
      },
      {
        // Faults: a PostgreSQL cluster and app server of their own (stopped and started on purpose),
        // so the server project's database is never touched.
        root,
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
