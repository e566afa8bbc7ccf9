/**
 * The compiled Node programs (src/ops/launch.mjs): `npm run --silent cli -- invert case.json` prints
 * exactly one JSON document on stdout (progress on stderr), from a build made once; a source file newer
 * than the build makes it stale, and building again makes it current.
 */
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { build, ensureBuilt, staleness } from '@/src/ops/launch.mjs';
import { programArgs, projectRoot } from '@/src/ops/paths';
import { freePort } from '@/db/pglocal';

describe('compiled programs', () => {
  it('npm run --silent cli prints only the JSON on stdout', async () => {
    await ensureBuilt();
    const r = spawnSync(
      'npm',
      ['run', '--silent', 'cli', '--', 'invert', 'fixtures/cases/two-minima.json', '--starts', '4', '--threads', '1'],
      { cwd: projectRoot, encoding: 'utf8', timeout: 120_000 },
    );
    expect(r.status).toBe(0);
    expect(r.stdout.endsWith('\n')).toBe(true);
    expect(r.stdout.trimEnd().includes('\n')).toBe(false);
    const out = JSON.parse(r.stdout) as { starts: number; minima: { count: number }[] };
    expect(out.starts).toBe(4);
    expect(out.minima.reduce((a, m) => a + m.count, 0)).toBe(4);
    expect(r.stderr).toMatch(/invert: 4\/4 starts/);
    expect(staleness()).toBeNull();
  });

  it('a source newer than the build makes it stale; building again makes it current', async () => {
    await ensureBuilt();
    const stamp = fs.statSync(path.join(projectRoot, 'dist', 'node', 'BUILT')).mtimeMs;
    const file = path.join(projectRoot, 'src', 'ops', 'launch.mjs');
    const later = new Date(stamp + 10);
    fs.utimesSync(file, later, later);
    expect(staleness()).toBe('src changed');
    await build('test');
    expect(staleness()).toBeNull();
  });

  it('the mail-catcher program stays up and listens (as npm start runs it)', async () => {
    await ensureBuilt();
    const port = await freePort();
    const child = spawn(process.execPath, programArgs('mail-catcher'), {
      cwd: projectRoot,
      env: { ...process.env, SMTP_PORT: String(port) },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout!.on('data', (b) => (out += b));
    child.stderr!.on('data', (b) => (out += b));
    const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)));
    const deadline = Date.now() + 60_000;
    while (!out.includes('catcher listening') && child.exitCode === null && Date.now() < deadline)
      await new Promise((r) => setTimeout(r, 50));
    expect(out).toContain(`[mail] catcher listening on 127.0.0.1:${port}`);
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
  }, 90_000);
});
