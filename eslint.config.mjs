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
    'dist/**',
  ]),
  {
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // Findings are errors: `npm test` fails on any of them.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/no-unused-expressions': 'error',
    },
  },
  {
    // House rule: one way to the data. Pages, route handlers and actions call the domain modules in src/.
    files: ['app/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['@/db', '@/db/*'], message: 'app/ calls the domain modules in src/, never db/ directly.' }] },
      ],
    },
  },
  {
    // House rule: the environment is read in src/settings.ts only (tests may set it).
    files: ['app/**', 'src/**', 'db/**'],
    ignores: ['src/settings.ts'],
    rules: {
      'no-restricted-properties': [
        'error',
        {
          object: 'process',
          property: 'env',
          message: 'Read settings through src/settings.ts (settings(), childEnv(), setEnv()).',
        },
      ],
    },
  },
]);
