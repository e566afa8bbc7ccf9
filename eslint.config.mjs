// ESLint flat config: the Next.js rules (core web vitals, React, hooks, accessibility, imports)
// and the TypeScript rules of typescript-eslint's recommended set. Formatting is Prettier's job.
import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores([
    'node_modules/**',
    '.next/**',
    '.data/**',
    'migrations/**',
    'fixtures/**',
    'public/**',
    'next-env.d.ts',
    'tmp/**',
    'test-results/**',
  ]),
  {
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // Findings are errors: `npm test` fails on any of them.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/no-unused-expressions': 'error',
    },
  },
]);
