import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Unit and integration tests. The database-backed ones read DATABASE_URL, which
// `npm test` (src/ops/test.ts) points at a throwaway PostgreSQL it starts itself.
export default defineConfig({
  resolve: { alias: { '@': fileURLToPath(new URL('../', import.meta.url)) } },
  test: {
    root: fileURLToPath(new URL('../', import.meta.url)),
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/e2e/**', 'node_modules/**'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
