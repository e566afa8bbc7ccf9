/** Folders and files the operations scripts work with, resolved from the project root. */
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The nearest folder above a module that holds package.json (the same from src/ and from a compiled build in dist/). */
function rootAbove(moduleUrl: string): string {
  let dir = path.dirname(fileURLToPath(moduleUrl));
  while (!fs.existsSync(path.join(dir, 'package.json'))) {
    const up = path.dirname(dir);
    if (up === dir) throw new Error(`no package.json above ${fileURLToPath(moduleUrl)}`);
    dir = up;
  }
  return dir;
}

export const projectRoot = rootAbove(import.meta.url);

/**
 * Whether a module is the script being run from its own TypeScript source (`npx tsx file.ts`). Always false in the
 * compiled programs (src/ops/launch.mjs), where several modules share one bundle file; they have entry points of
 * their own instead.
 */
export function runAsScript(moduleUrl: string): boolean {
  return moduleUrl.endsWith('.ts') && !!process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(moduleUrl);
}

/** Node arguments that run one of the compiled programs (src/ops/launch.mjs builds it first when stale). */
export function programArgs(name: 'worker' | 'mail-catcher' | 'cli'): string[] {
  return [path.join(projectRoot, 'src', 'ops', 'launch.mjs'), name];
}
export const dataRoot = path.join(projectRoot, '.data');
export const nextBin = path.join(projectRoot, 'node_modules', 'next', 'dist', 'bin', 'next');
export const vitestBin = path.join(projectRoot, 'node_modules', 'vitest', 'vitest.mjs');
export const eslintBin = path.join(projectRoot, 'node_modules', 'eslint', 'bin', 'eslint.js');
export const prettierBin = path.join(projectRoot, 'node_modules', 'prettier', 'bin', 'prettier.cjs');
/** Serialises `next build` between everyone sharing this machine. */
export const NEXT_LOCK = '/tmp/cavitas-next.lock';
