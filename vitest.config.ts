import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = { '@': fileURLToPath(new URL('.', import.meta.url)) };

// Two projects: the pure core (no database) and the server side (routes, data layer) that runs
// against a PostgreSQL database created fresh for the run by the global setup.
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
    ],
  },
});
