import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Unit and integration tests, in two projects:
// - `pure`: test/engine and test/cli — no database, files run in parallel.
// - `db`: everything else (repositories, route handlers, worker, mail, ops). Its globalSetup
//   starts a throwaway PostgreSQL when DATABASE_URL is unset (`npm test` sets it itself), and its
//   files run one at a time so a file may truncate tables with test/helpers/db.ts resetDatabase().
const root = fileURLToPath(new URL('../', import.meta.url));
const pure = [
  'test/engine/**/*.test.ts',
  'test/cli/**/*.test.ts',
  'test/design/**/*.test.ts',
  'test/web/ui/**/*.test.ts',
  'test/runs/confidence.test.ts',
];

export default defineConfig({
  resolve: { alias: { '@': root } },
  test: {
    root,
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 120_000,
    projects: [
      {
        extends: true,
        test: { name: 'pure', include: pure },
      },
      {
        extends: true,
        test: {
          name: 'db',
          include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
          exclude: [...pure, 'test/e2e/**', 'node_modules/**'],
          globalSetup: ['test/setup/global-db.ts'],
          fileParallelism: false,
        },
      },
    ],
  },
});
