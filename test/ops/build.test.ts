import { afterEach, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { buildStaleness, newestMtime, BUILD_INPUTS, holdSharedBuildLock } from '@/src/ops/build';

const dirs: string[] = [];
function project(): string {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), 'cavitas-build-'));
  dirs.push(d);
  for (const f of ['app/page.tsx', 'src/a.ts', 'db/b.ts', 'public/x.svg', 'next.config.mjs', 'package.json']) {
    fs.mkdirSync(path.dirname(path.join(d, f)), { recursive: true });
    fs.writeFileSync(path.join(d, f), 'x');
  }
  return d;
}
function touch(file: string, secondsFromNow: number): void {
  const t = new Date(Date.now() + secondsFromNow * 1000);
  fs.utimesSync(file, t, t);
}
function writeBuildId(d: string, secondsFromNow: number): void {
  fs.mkdirSync(path.join(d, '.next'), { recursive: true });
  fs.writeFileSync(path.join(d, '.next', 'BUILD_ID'), 'id');
  touch(path.join(d, '.next', 'BUILD_ID'), secondsFromNow);
}
afterEach(() => dirs.splice(0).forEach((d) => fs.rmSync(d, { recursive: true, force: true })));

describe('build staleness', () => {
  it('is stale without a BUILD_ID', () => {
    expect(buildStaleness(project())).toEqual({ stale: true, reason: 'no production build yet' });
  });

  it('is fresh when BUILD_ID is newer than every input, stale when any input is newer', () => {
    const d = project();
    writeBuildId(d, 60);
    expect(buildStaleness(d).stale).toBe(false);
    touch(path.join(d, 'src', 'a.ts'), 120);
    expect(buildStaleness(d)).toEqual({ stale: true, reason: 'src changed since the last build' });
  });

  it('ignores files outside the build inputs (tests, data folder)', () => {
    const d = project();
    writeBuildId(d, 60);
    fs.mkdirSync(path.join(d, 'test'), { recursive: true });
    fs.writeFileSync(path.join(d, 'test', 'x.test.ts'), 'x');
    touch(path.join(d, 'test', 'x.test.ts'), 600);
    expect(BUILD_INPUTS).not.toContain('test');
    expect(buildStaleness(d).stale).toBe(false);
  });

  it('newestMtime finds the newest file deep in a tree, 0 for a missing path', () => {
    const d = project();
    fs.mkdirSync(path.join(d, 'src', 'deep', 'er'), { recursive: true });
    const f = path.join(d, 'src', 'deep', 'er', 'z.ts');
    fs.writeFileSync(f, 'z');
    touch(f, 300);
    expect(newestMtime(path.join(d, 'src'))).toBe(fs.statSync(f).mtimeMs);
    expect(newestMtime(path.join(d, 'nope'))).toBe(0);
  });
});

describe('shared build lock', () => {
  // flock(1) semantics (util-linux): a shared lock blocks an exclusive one, not another shared one.
  const tryLock = (mode: '-s' | '-x', file: string) => spawnSync('flock', ['-n', mode, file, 'true']).status;

  it('blocks an exclusive lock while held, allows shared ones, and frees it on release', async () => {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'cavitas-lock-')), 'next.lock');
    dirs.push(path.dirname(file));
    const release = await holdSharedBuildLock(file);
    expect(tryLock('-x', file)).toBe(1);
    expect(tryLock('-s', file)).toBe(0);
    release();
    const until = Date.now() + 5_000;
    while (tryLock('-x', file) !== 0 && Date.now() < until) await new Promise((r) => setTimeout(r, 50));
    expect(tryLock('-x', file)).toBe(0);
  });
});
