import { afterAll, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { programArgs } from '@/src/ops/paths';
import { fileURLToPath } from 'node:url';
import { enqueue, getBoss, stopBoss } from '@/db/jobs';
import { serveJobs, type WorkerHandle } from '@/src/worker/run';
import type { JobDefinition } from '@/src/worker/types';
import { jobs as registry } from '@/src/worker/registry';

const root = fileURLToPath(new URL('../../', import.meta.url));

function waitFor(check: () => boolean, timeoutMs = 30_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  return new Promise((resolve, reject) => {
    const tick = () => {
      if (check()) return resolve();
      if (Date.now() > until) return reject(new Error('condition not met in time'));
      setTimeout(tick, 50);
    };
    tick();
  });
}

describe('worker', () => {
  let handle: WorkerHandle | null = null;
  afterAll(async () => {
    await handle?.stop(5_000);
    await stopBoss(5_000);
  });

  it('registry lists each queue once and every definition has a handler', () => {
    const names = registry.map((d) => d.queue);
    expect(new Set(names).size).toBe(names.length);
    for (const d of registry) expect(typeof d.handler).toBe('function');
  });

  it('serves a test queue: every job runs exactly once with its data, failures are retried', async () => {
    const seen = new Map<string, number>();
    let failuresLeft = 1;
    const sum: JobDefinition<{ a: number; b: number; tag: string }> = {
      queue: 'infra-test-sum',
      teamSize: 3,
      pollingIntervalSeconds: 0.5,
      queueOptions: { retryLimit: 2, retryDelay: 0 },
      handler: async (batch) => {
        expect(Array.isArray(batch)).toBe(true); // pg-boss 10 hands over an array
        for (const job of batch) {
          if (job.data.tag === 'flaky' && failuresLeft-- > 0) throw new Error('first attempt fails on purpose');
          seen.set(job.data.tag, (seen.get(job.data.tag) ?? 0) + 1);
        }
        return batch.map((j) => j.data.a + j.data.b);
      },
    };
    handle = await serveJobs([sum], () => {});
    const tags = Array.from({ length: 12 }, (_, i) => `job-${i}`).concat('flaky');
    const ids = await Promise.all(tags.map((tag, i) => enqueue(sum.queue, { a: i, b: 2, tag })));
    expect(new Set(ids).size).toBe(tags.length);
    await waitFor(() => tags.every((t) => seen.has(t)));
    for (const t of tags) expect(seen.get(t)).toBe(1);
    expect(failuresLeft).toBe(-1); // the flaky job failed once, then ran again

    // The handler's return value is kept as the job's output.
    const boss = await getBoss();
    const job = await boss.getJobById(sum.queue, ids[5]);
    expect(job?.state).toBe('completed');
    expect(job?.output).toEqual({ value: [5 + 2] });
  });

  it('the worker process starts, reports ready, and exits 0 on SIGTERM', async () => {
    // Earlier test files may leave jobs queued in the shared test database; a worker busy with
    // one would (rightly) finish it before exiting. Start from empty queues.
    const boss = await getBoss();
    for (const j of registry) if (await boss.getQueue(j.queue)) await boss.purgeQueue(j.queue);
    const child = spawn(process.execPath, programArgs('worker'), {
      cwd: root,
      env: { ...process.env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (b) => (out += b));
    child.stderr.on('data', (b) => (out += b));
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    await waitFor(() => out.includes('[worker] ready') || child.exitCode !== null, 60_000);
    expect(out).toContain('[worker] ready');
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
    expect(out).toContain('[worker] stopped');
  });
});
