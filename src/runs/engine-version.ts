/**
 * The engine version recorded on every run: the package version plus a short
 * SHA-256 over the engine's source files (path and content, sorted), so two
 * runs with equal versions computed with identical code.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

let cached: string | null = null;

function files(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...files(p));
    else if (p.endsWith('.ts')) out.push(p);
  }
  return out;
}

export function engineVersion(root = process.cwd()): string {
  if (cached) return cached;
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string };
  const hash = createHash('sha256');
  try {
    for (const f of files(join(root, 'src', 'engine'))) {
      hash.update(relative(root, f));
      hash.update('\0');
      hash.update(readFileSync(f));
    }
  } catch {
    hash.update('engine sources not readable');
  }
  cached = `${pkg.version}+${hash.digest('hex').slice(0, 12)}`;
  return cached;
}
