import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  resolve: { alias: { '@': fileURLToPath(new URL('.', import.meta.url)) } },
  test: {
    include: ['tests/**/*.test.ts'],
    exclude: ['tests/browser/**', 'node_modules/**'],
    execArgv: ['--import', 'tsx'],
    globalSetup: ['tests/setup/global-db.ts'],
    testTimeout: 20000,
    hookTimeout: 60000,
  },
});
