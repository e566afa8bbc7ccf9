import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import http from 'node:http';
import { afterCrash, Supervisor, waitForHttp } from '@/src/ops/supervisor';

const node = process.execPath;

function processState(pid: number): string {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2).split(' ')[0];
  } catch {
    return 'gone';
  }
}
const FAST = { baseDelayMs: 100, maxDelayMs: 400, maxCrashes: 5, crashWindowMs: 60_000 };

async function until<T>(probe: () => T | undefined, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = probe();
    if (v !== undefined) return v;
    if (Date.now() > deadline) throw new Error('condition not reached in time');
    await new Promise((r) => setTimeout(r, 20));
  }
}
const spec = (name: string, code: string) => ({ name, command: node, args: ['-e', code], env: process.env, cwd: process.cwd() });

describe('supervisor', () => {
  it('prefixes child output and stops children (and their own children) with SIGTERM', async () => {
    const lines: string[] = [];
    const unexpected: string[] = [];
    const sup = new Supervisor(
      (l) => lines.push(l),
      (n) => unexpected.push(n),
    );
    // The child starts a grandchild in the same process group, then waits forever.
    const child = sup.start(
      spec(
        'alpha',
        `const { spawn } = require('child_process');
         const g = spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
         console.log('grandchild ' + g.pid);
         setInterval(() => {}, 1000);`,
      ),
    );
    while (!lines.some((l) => l.includes('grandchild'))) await new Promise((r) => setTimeout(r, 20));
    const grandchild = Number(
      lines
        .find((l) => l.includes('grandchild'))!
        .split(' ')
        .pop(),
    );
    expect(lines[0]).toMatch(/^alpha\s*\| grandchild \d+$/);
    await sup.stopAll(5_000);
    expect(child.signalCode).toBe('SIGTERM');
    expect(unexpected).toEqual([]);
    // Gone, or a zombie awaiting reaping by init (state "Z" in /proc/<pid>/stat, proc(5)).
    await new Promise((r) => setTimeout(r, 200));
    expect(['gone', 'Z']).toContain(processState(grandchild));
  });

  it('restarts a child killed with SIGKILL after the back-off, while its sibling keeps running', async () => {
    const lines: string[] = [];
    const gaveUp: string[] = [];
    const sup = new Supervisor(
      (l) => lines.push(l),
      (n) => gaveUp.push(n),
      FAST,
    );
    sup.start(spec('victim', 'setInterval(() => {}, 1000)'));
    sup.start(spec('sibling', 'setInterval(() => {}, 1000)'));
    const first = sup.pid('victim')!;
    const sibling = sup.pid('sibling')!;
    process.kill(first, 'SIGKILL');
    const restarted = await until(() => {
      const p = sup.pid('victim');
      return p !== undefined && p !== first ? p : undefined;
    });
    expect(processState(first)).toBe('gone');
    expect(['S', 'R']).toContain(processState(restarted));
    expect(sup.pid('sibling')).toBe(sibling);
    expect(lines.some((l) => /^victim\s*\| exited unexpectedly \(killed by SIGKILL\); restarting in 0\.1 s$/.test(l))).toBe(true);
    expect(lines.some((l) => /^victim\s*\| restarted \(pid \d+\)$/.test(l))).toBe(true);
    expect(gaveUp).toEqual([]);
    await sup.stopAll(2_000);
    expect(sup.pid('victim')).toBeUndefined();
  });

  it('gives up on a child that keeps crashing and says which and why; the others stay up', async () => {
    const given: Array<[string, string]> = [];
    const sup = new Supervisor(
      () => {},
      (n, why) => given.push([n, why]),
      FAST,
    );
    sup.start(spec('steady', 'setInterval(() => {}, 1000)'));
    sup.start(spec('flaky', 'process.exit(3)'));
    await until(() => given.length > 0 || undefined);
    expect(given).toEqual([['flaky', 'exit code 3; it crashed 5 times within 60 s']]);
    expect(sup.isSupervised('flaky')).toBe(false);
    expect(sup.pid('steady')).toBeDefined();
    await new Promise((r) => setTimeout(r, 300)); // no restart after giving up
    expect(sup.pid('flaky')).toBeUndefined();
    await sup.stopAll(2_000);
  });

  it('stopAll cancels a pending restart', async () => {
    const lines: string[] = [];
    const sup = new Supervisor((l) => lines.push(l), undefined, { ...FAST, baseDelayMs: 400 });
    sup.start(spec('gamma', 'process.exit(1)'));
    await until(() => lines.find((l) => l.includes('restarting in 0.4 s')));
    await sup.stopAll(1_000);
    await new Promise((r) => setTimeout(r, 700));
    expect(lines.filter((l) => l.includes('restarted'))).toEqual([]);
  });

  it('back-off doubles per crash inside the window, is capped, and forgets crashes older than the window', () => {
    const p = { baseDelayMs: 1_000, maxDelayMs: 30_000, maxCrashes: 5, crashWindowMs: 60_000 };
    let crashes: number[] = [];
    const delays: number[] = [];
    for (const t of [0, 1_000, 3_000, 7_000]) {
      const r = afterCrash(crashes, t, p);
      expect(r.giveUp).toBe(false);
      delays.push(r.delayMs);
      crashes = r.crashes;
    }
    expect(delays).toEqual([1_000, 2_000, 4_000, 8_000]);
    expect(afterCrash(crashes, 15_000, p).giveUp).toBe(true); // fifth within a minute
    expect(afterCrash(crashes, 61_500, p)).toMatchObject({ giveUp: false, crashes: [3_000, 7_000, 61_500], delayMs: 4_000 });
    expect(
      afterCrash(
        [1, 2, 3, 4, 5, 6, 7].map((i) => 1_000 + i),
        2_000,
        { ...p, maxCrashes: 99 },
      ).delayMs,
    ).toBe(30_000);
  });

  it('waitForHttp resolves with the status once a server answers, and rejects on timeout', async () => {
    const server = http.createServer((_, res) => res.writeHead(204).end());
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
    const { port } = server.address() as { port: number };
    await expect(waitForHttp(`http://127.0.0.1:${port}/`, 5_000)).resolves.toBe(204);
    await new Promise((r) => server.close(r));
    await expect(waitForHttp(`http://127.0.0.1:${port}/`, 700)).rejects.toThrow(/did not answer/);
  });
});
