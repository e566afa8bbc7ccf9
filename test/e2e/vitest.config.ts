import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Browser tests: one file at a time in one fork, long timeouts (the first run may build the app).
// Without DATABASE_URL the globalSetup starts a throwaway PostgreSQL, as for the unit tests.
const root = fileURLToPath(new URL('../../', import.meta.url));

export default defineConfig({
  resolve: { alias: { '@': root } },
  test: {
    root,
    include: ['test/e2e/**/*.e2e.ts'],
    environment: 'node',
    globalSetup: ['test/setup/global-db.ts'],
    fileParallelism: false,
    pool: 'forks',
    maxWorkers: 1,
    testTimeout: 120_000,
    hookTimeout: 900_000,
  },
});
