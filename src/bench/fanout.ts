/**
 * One run shared by several worker processes (no pass/fail), on a throwaway PostgreSQL of its
 * own: the inverter's day problem of `npm run bench -- runs` (c2) — 144 intervals x 16 starts,
 * 12 invented stations x 3 components — launched as a run (cut into chunks, one job each) and
 * worked by one single-threaded worker process, then by two (CAVITAS_RUN_THREADS=1,
 * WORKER_CONCURRENCY=1 each). The workers are started and ready before the launch; the wall
 * time runs from the launch to the run's end. Prints both walls, their ratio (the goal on a
 * 2-core machine: two workers at least 1.6 times as fast as one), the load averages, the CPU
 * seconds of the workers and the database, the chunks each worker took, and whether every interval's result (minima, start ends, counts; not the time it took) is the
 * same in both runs.
 *
 * BENCH_RUN_DAY_INTERVALS / BENCH_RUN_DAY_STARTS scale the day, BENCH_FANOUT_ROUNDS (default 1)
 * repeats the pair (in alternating order; medians printed), BENCH_FANOUT_WORKERS (default 2)
 * sets the larger worker count. Every process and database it starts is stopped at the end.
 */
import { randomUUID } from 'node:crypto';
import { spawn, type ChildProcess } from 'node:child_process';
import { loadavg } from 'node:os';
import { startThrowawayPostgres, type ThrowawayPg } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { closeDatabase } from '@/db/lifecycle';
import { stopBoss } from '@/db/jobs';
import { insertUser } from '@/db/repo/users';
import { getRunById, listRunIntervals } from '@/db/repo/runs';
import { listRunChunks } from '@/db/repo/run-chunks';
import { launchRun } from '@/src/runs/launch';
import { hasEnded } from '@/src/runs/lifecycle';
import { programArgs, projectRoot } from '@/src/ops/paths';
import { childEnv, setEnv, settings } from '@/src/settings';
import { pgCpuSeconds, seedDay } from './runs';
import { readFileSync } from 'node:fs';

const load = () =>
  loadavg()
    .map((x) => x.toFixed(2))
    .join(' / ');

interface Worker {
  child: ChildProcess;
  out: () => string;
}

function startWorker(url: string): Worker {
  const child = spawn(process.execPath, programArgs('worker'), {
    cwd: projectRoot,
    env: childEnv({ DATABASE_URL: url, CAVITAS_RUN_THREADS: '1', WORKER_CONCURRENCY: '1' }),
    stdio: ['ignore', 'pipe', 'pipe'],
    // A session of its own, as a worker started from its own terminal or machine: Linux's
    // scheduler (autogroup) shares the CPU between sessions first, so workers started from one
    // session would split one session's share on a busy machine.
    detached: true,
  });
  let out = '';
  child.stdout!.on('data', (b) => (out += b));
  child.stderr!.on('data', (b) => (out += b));
  return { child, out: () => out };
}

async function waitFor(what: string, probe: () => Promise<boolean> | boolean, timeoutMs: number, everyMs = 100) {
  const deadline = Date.now() + timeoutMs;
  while (!(await probe())) {
    if (Date.now() > deadline) throw new Error(`${what}: not reached within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

async function stopWorkers(workers: Worker[]): Promise<void> {
  await Promise.all(
    workers.map(
      (w) =>
        new Promise<void>((resolve) => {
          if (w.child.exitCode !== null || w.child.signalCode !== null) return resolve();
          w.child.once('exit', () => resolve());
          w.child.kill('SIGTERM');
        }),
    ),
  );
}

/** What an interval's result says, without the time it took. */
function resultsOf(rows: Awaited<ReturnType<typeof listRunIntervals>>): string[] {
  return rows.map((r) => {
    const { seconds: _seconds, ...rest } = r.result as { seconds?: number };
    return `${r.startsAt.toISOString()} ${JSON.stringify(rest)}`;
  });
}

/** Launches the day as a run before `n` ready workers and waits for its end; the wall in seconds. */
async function dayWith(n: number, url: string, networkId: string, userId: string, config: Parameters<typeof launchRun>[2]) {
  const workers = Array.from({ length: n }, () => startWorker(url));
  try {
    for (const w of workers) await waitFor('worker ready', () => w.out().includes('[worker] ready'), 60_000);
    const before = load();
    const cpu0 = workers.map((w) => cpuSeconds(w.child.pid!));
    const pg0 = pgCpuSeconds();
    const t0 = performance.now();
    const run = await launchRun(networkId, userId, { ...config, name: `Bench day, ${n} worker(s)` });
    await waitFor('the run to end', async () => hasEnded((await getRunById(run.id))!.state), 30 * 60_000, 50);
    const wallS = (performance.now() - t0) / 1000;
    const cpu = workers.map((w, i) => cpuSeconds(w.child.pid!) - cpu0[i]);
    const pg1 = pgCpuSeconds();
    const end = (await getRunById(run.id))!;
    if (end.state !== 'finished') throw new Error(`the run ended ${end.state}: ${end.error ?? ''}`);
    const share = new Map<string, number>();
    for (const c of await listRunChunks(run.id)) {
      const pid = c.workerId!.split(':')[1];
      share.set(pid, (share.get(pid) ?? 0) + 1);
    }
    const pids = [...share].map(([pid, k]) => `${pid}: ${k}`).join(', ');
    console.log(
      `  ${n} worker(s): ${wallS.toFixed(1)} s wall for ${end.progress.intervalsDone} intervals; chunks per worker process ${pids}; ` +
        `CPU of the workers ${cpu.map((c) => c.toFixed(1)).join(' + ')} s, of the database ${pg0 === null || pg1 === null ? '?' : (pg1 - pg0).toFixed(1)} s ` +
        `(load before ${before}, after ${load()})`,
    );
    return { wallS, results: resultsOf(await listRunIntervals(run.id)) };
  } finally {
    await stopWorkers(workers);
  }
}

/** CPU seconds (user + system) a running process has used so far (Linux /proc; USER_HZ 100). */
function cpuSeconds(pid: number): number {
  const f = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = f.slice(f.lastIndexOf(')') + 2).split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export default async function main(): Promise<void> {
  const s = settings();
  const many = s.BENCH_FANOUT_WORKERS;
  let pg: ThrowawayPg | null = null;
  const previousUrl = s.DATABASE_URL;
  try {
    pg = await startThrowawayPostgres();
    setEnv('DATABASE_URL', pg.url);
    await migrate(pg.url);
    const userId = `bench-${randomUUID()}`;
    await insertUser({ id: userId, email: `${userId}@example.test`, name: 'Bench', passwordHash: 'x' });
    const { networkId, config } = await seedDay(userId);
    console.log(
      `a day of ${s.BENCH_RUN_DAY_INTERVALS} intervals x ${config.starts} starts as a run, in chunks of ${s.CAVITAS_RUN_CHUNK} intervals; ` +
        `single-threaded workers; load at start ${load()}`,
    );
    const one: number[] = [];
    const two: number[] = [];
    let same = true;
    for (let round = 0; round < s.BENCH_FANOUT_ROUNDS; round++) {
      const order = round % 2 === 0 ? [1, many] : [many, 1];
      const got: Record<number, { wallS: number; results: string[] }> = {};
      for (const n of order) got[n] = await dayWith(n, pg.url, networkId, userId, config);
      one.push(got[1].wallS);
      two.push(got[many].wallS);
      const a = got[1].results;
      const b = got[many].results;
      same &&= a.length === b.length && a.every((x, i) => x === b[i]);
    }
    const ratio = median(one) / median(two);
    console.log(
      `fan-out: 1 worker ${median(one).toFixed(1)} s, ${many} workers ${median(two).toFixed(1)} s (medians of ${one.length}): ` +
        `${many} workers ${ratio.toFixed(2)}x as fast (goal >= 1.6x for 2 workers on 2 cores); ` +
        `per-interval results ${same ? 'identical' : 'DIFFER'}; load now ${load()}`,
    );
  } finally {
    await stopBoss(5_000).catch(() => {});
    await closeDatabase().catch(() => {});
    await pg?.stop().catch(() => {});
    setEnv('DATABASE_URL', previousUrl);
  }
}
