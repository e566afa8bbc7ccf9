/** Folders and files the operations scripts work with, resolved from the project root. */
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const projectRoot = fileURLToPath(new URL('../../', import.meta.url));
export const dataRoot = path.join(projectRoot, '.data');
export const nextBin = path.join(projectRoot, 'node_modules', 'next', 'dist', 'bin', 'next');
export const vitestBin = path.join(projectRoot, 'node_modules', 'vitest', 'vitest.mjs');
export const eslintBin = path.join(projectRoot, 'node_modules', 'eslint', 'bin', 'eslint.js');
export const prettierBin = path.join(projectRoot, 'node_modules', 'prettier', 'bin', 'prettier.cjs');
/** Serialises `next build` between everyone sharing this machine. */
export const NEXT_LOCK = '/tmp/cavitas-next.lock';
