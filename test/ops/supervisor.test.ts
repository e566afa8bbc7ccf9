import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import http from 'node:http';
import { Supervisor, waitForHttp } from '@/src/ops/supervisor';

const node = process.execPath;

function processState(pid: number): string {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2).split(' ')[0];
  } catch {
    return 'gone';
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

  it('reports a child that exits on its own', async () => {
    const unexpected: Array<[string, number | null]> = [];
    const sup = new Supervisor(
      () => {},
      (n, c) => unexpected.push([n, c]),
    );
    sup.start(spec('beta', 'process.exit(3)'));
    while (unexpected.length === 0) await new Promise((r) => setTimeout(r, 20));
    expect(unexpected).toEqual([['beta', 3]]);
    await sup.stopAll(1_000);
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
