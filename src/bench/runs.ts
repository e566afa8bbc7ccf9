/**
 * Run measurements (no pass/fail), on a throwaway PostgreSQL of its own:
 *  (a) launching — median wall time of `launchRun` (the service the POST route calls) over a
 *      day of 144 intervals, three stations x three components;
 *  (b) the run page — median of `getRunView` (the page's server data), and, when a production
 *      build exists in .next, the full page load in headless chromium until every figure of the
 *      first view is drawn (map, series curves, correlation matrix, starts, fitted spectrum and
 *      residuals: all in the server's HTML), and until every figure is live (redrawn by the
 *      browser at its own width, with hover tips);
 *  (c) storing results — the run driver (`executeRun`, as the worker calls it) over the 144
 *      intervals against the engine alone on the same intervals (data in memory, nothing stored),
 *      alternated over three rounds (the median of the three is noisy on a loaded machine); the
 *      driver's time outside the solver calls per interval (ms) and as a share of the solve time;
 *      and the median time of one result write on its own. The spectra carry the scatter of a
 *      100-segment Welch estimate (power x Gamma(K, 1/K), K = 100 — common practice), so the solves
 *      take as long as on real data. Its solves are quick (~5 ms), so it shows the driver's fixed
 *      cost per interval;
 *  (c2) storing results on the inverter's own day problem (as `npm run bench -- inverse`): 12
 *      invented stations x 3 components x 141 bins (5–40 Hz at 0.25 Hz), three moving regions with
 *      free intensity and centre (9 parameters), 144 intervals x 16 starts, Welch-scattered as in
 *      (c), seeded in a second network of the same database; the driver against the engine alone
 *      on the same intervals, alternating as (c) does: both walls, the median extra %, the time
 *      outside the solver calls per interval, the solver calls' own total on each side with the
 *      CPU seconds of this process and of the database server (and the driver's extra CPU in %,
 *      less disturbed than wall time by other work on a shared machine, though not immune), and
 *      whether the day stays within the inverter's 60 s plus 10 % for storing.
 * Every server, browser and database it starts is stopped at the end, also on error.
 * Run with `npm run bench -- runs`. BENCH_RUN_INTERVALS (default 144) and BENCH_RUN_STARTS
 * (default 16, as the launch form) scale (a)–(c) down or up; BENCH_RUN_PAGE=0 leaves out the browser.
 * (c2): BENCH_RUN_DAY_INTERVALS (default 144), BENCH_RUN_DAY_STARTS (default 16) and
 * BENCH_RUN_DAY_ROUNDS (default 3) scale it; BENCH_RUN_DAY=0 leaves it out. The 60 s check
 * scales a shortened day to 144 intervals. BENCH_RUN_PROBE=1 adds to each round of (c) and (c2)
 * the driver without database work during the day (data from memory, one write at the end), to
 * tell the loads and writes apart from the rest of the driver.
 */
import { randomUUID } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { startThrowawayPostgres, type ThrowawayPg } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { insertUser } from '@/db/repo/users';
import { createNetwork } from '@/db/repo/networks';
import { createRun, getRunById, listRunIntervals, saveRunInterval } from '@/db/repo/runs';
import { bandFrequencies } from '@/src/engine/band';
import type { RunConfig } from '@/src/runs/config';
import { launchRun } from '@/src/runs/launch';
import { getRunView } from '@/src/runs/results';
import { executeRun } from '@/src/runs/execute';
import { loadRunContext } from '@/src/runs/context';
import { intervalLoader, loadIntervalObservations } from '@/src/runs/observations';
import { engineSolver } from '@/src/runs/solver';
import { engineVersion } from '@/src/runs/engine-version';
import { startSession } from '@/src/auth/session';
import { SESSION_COOKIE } from '@/src/auth/lucia';
import { launchBrowser } from '@/src/ops/browser';
import { setEnv, settings } from '@/src/settings';
import { hasProductionBuild, startNextServer } from './next-server';
import { tearDownBench } from './teardown';
import { REGION_COLOURS } from '@/src/design/tokens';
import { boxRegion, seedSyntheticNetwork, tenMinuteStarts } from '@/src/runs/synthetic-network';

const BENCH = settings();
const INTERVALS = BENCH.BENCH_RUN_INTERVALS;
const STARTS = BENCH.BENCH_RUN_STARTS; // the launch form's default
const DAY_INTERVALS = BENCH.BENCH_RUN_DAY_INTERVALS;
const DAY_STARTS = BENCH.BENCH_RUN_DAY_STARTS;
const DAY_ROUNDS = BENCH.BENCH_RUN_DAY_ROUNDS;
/** The inverter's target for a day of 144 intervals x 16 starts (src/bench/inverse.ts), and the share allowed for storing. */
const DAY_TARGET_S = 60;
const STORING_SHARE = 0.1;
const PROBE = BENCH.BENCH_RUN_PROBE;
const CAVITY = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
const BAND = { minHz: 6, maxHz: 30, stepHz: 0.5 };
// An invented scenario: three huts and three source regions, not real sites.
const SITES = [
  { code: 'BR1', name: 'Bench hut north', latitude: 52.1, longitude: 12.4 },
  { code: 'BR2', name: 'Bench hut south', latitude: -33.2, longitude: 146.8 },
  { code: 'BR3', name: 'Bench hut west', latitude: 38.6, longitude: -104.2 },
];
const SOURCES = [
  { lat: -2, lon: 24, intensity: 3e4 },
  { lat: -5, lon: -50, intensity: 2e4 },
  { lat: -5, lon: 120, intensity: 1.5e4 },
];

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const n = s.length;
  return n % 2 ? s[(n - 1) / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
};
const ms = (x: number) => `${x.toFixed(x < 10 ? 2 : 0)} ms`;

/** What both bench networks share: three-component huts at 200 m, the linear cavity, 100-segment Welch scatter (gamma). */
const benchSpec = (networkId: string, userId: string, modelName: string, noiseSeed: number) => ({
  networkId,
  userId,
  components: ['Ez', 'Bns', 'Bew'] as const,
  elevationM: 200,
  model: { name: modelName, cavity: CAVITY },
  noise: { kind: 'gamma' as const, seed: noiseSeed },
});

export async function seed() {
  const userId = `bench-${randomUUID()}`;
  await insertUser({ id: userId, email: `${userId}@example.test`, name: 'Bench analyst', passwordHash: 'x' });
  const network = await createNetwork('Bench network', userId);
  const { config } = await seedSyntheticNetwork({
    ...benchSpec(network.id, userId, 'Bench linear', 20310702),
    sites: SITES,
    grid: {
      name: 'Bench belts',
      notes: '',
      cellSizeDeg: 10,
      regions: [
        boxRegion({
          key: 'africa-belt',
          name: 'Eastern belt',
          colour: REGION_COLOURS[1],
          lat: { min: -20, max: 20 },
          lon: { min: 0, max: 40 },
        }),
        { key: 'america-belt', name: 'Western belt', colour: REGION_COLOURS[5], kind: 'cells', cells: [300, 301] },
        { key: 'asia-belt', name: 'Far eastern belt', colour: REGION_COLOURS[2], kind: 'cells', cells: [317, 318] },
      ],
    },
    band: BAND,
    starts: tenMinuteStarts(Date.UTC(2031, 6, 2, 0, 0, 0), INTERVALS),
    sources: SOURCES,
    run: {
      name: 'Bench day',
      regions: [
        { region: 'africa-belt', intensity: { min: 1e2, max: 1e6 }, lat: { min: -15, max: 15 }, lon: { min: 5, max: 35 } },
        { region: 'america-belt', intensity: { min: 1e2, max: 1e6 } },
        { region: 'asia-belt', intensity: { min: 1e2, max: 1e6 } },
      ],
      scaleCovariance: false,
      starts: STARTS,
      seed: 11,
    },
  });
  return { userId, networkId: network.id, config };
}

async function measureLaunch(networkId: string, userId: string, config: RunConfig): Promise<void> {
  const times: number[] = [];
  for (let i = 0; i < 6; i++) {
    const t0 = performance.now();
    await launchRun(networkId, userId, config);
    times.push(performance.now() - t0);
  }
  times.shift(); // first call warms the pool and the queue
  console.log(
    `(a) launchRun, ${INTERVALS} intervals x 3 stations x 3 components: median ${ms(median(times))} of ${times.length} (target < 200 ms)`,
  );
}

/** CPU seconds (user + system) of the database server: the postmaster, its reaped and its live backends. */
export function pgCpuSeconds(): number | null {
  try {
    const port = new URL(settings().DATABASE_URL ?? '').port;
    const tick = 100; // USER_HZ on Linux
    const stat = (pid: string) => {
      const line = readFileSync(`/proc/${pid}/stat`, 'utf8');
      return line.slice(line.lastIndexOf(')') + 2).split(' ');
    };
    const pids = readdirSync('/proc').filter((d) => /^\d+$/.test(d));
    const master = pids.find((pid) => {
      try {
        const argv = readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0');
        return /postgres$/.test(argv[0]) && argv.some((x, i) => x === '-p' && argv[i + 1] === port);
      } catch {
        return false;
      }
    });
    if (!master) return null;
    // fields after the command: state(0) ppid(1) … utime(11) stime(12) cutime(13) cstime(14)
    const m = stat(master);
    let ticks = Number(m[11]) + Number(m[12]) + Number(m[13]) + Number(m[14]);
    for (const pid of pids) {
      try {
        const f = stat(pid);
        if (f[1] === master) ticks += Number(f[11]) + Number(f[12]);
      } catch {
        /* ended meanwhile */
      }
    }
    return ticks / tick;
  } catch {
    return null;
  }
}

interface Pass {
  wallMs: number;
  solveMs: number;
  cpuS: number;
  pgCpuS: number | null;
}
/**
 * The driver's extra CPU (this process and the database server) over the engine alone, in % per
 * round: less disturbed than wall time by other work on a shared machine (not immune: CPU time
 * grows too when the cores are shared).
 */
const cpuExtra = (passes: { driver: Pass; alone: Pass }[]) =>
  passes.map(({ driver: d, alone: a }) => {
    const total = (p: Pass) => p.cpuS + (p.pgCpuS ?? 0);
    return (100 * (total(d) - total(a))) / total(a);
  });
const cpu = (p: Pass) =>
  `${p.cpuS.toFixed(1)} s CPU here, ${p.pgCpuS === null ? '?' : p.pgCpuS.toFixed(1)} s in the database server`;

/**
 * The day through the worker's driver against the engine alone on the same intervals (data in
 * memory, nothing stored), round by round, alternating the two so that the load of a shared
 * machine falls on both. Each pass records its wall time, the time inside the solver calls, and the
 * CPU seconds of this process (all its threads) and of the database server.
 */
async function driverAgainstEngine(tag: string, networkId: string, userId: string, config: RunConfig, rounds: number) {
  const { checkLaunch } = await import('@/src/runs/launch');
  const { preview } = await checkLaunch(networkId, config);
  const newRun = (name: string) =>
    createRun({
      networkId,
      name,
      config: config as unknown as Record<string, unknown>,
      modelId: config.modelId,
      gridId: config.gridId,
      engineVersion: engineVersion(),
      intervalStarts: preview!.intervalStarts,
      startsPerInterval: config.starts,
      createdBy: userId,
    });
  const probe = await newRun(`${config.name}, engine alone`);
  const ctx = await loadRunContext(probe);
  const cases = await Promise.all(
    probe.intervalStarts.map(async (startsAt) => ({
      startsAt,
      ...(await loadIntervalObservations(networkId, config, new Date(startsAt))),
    })),
  );
  const measure = async (body: () => Promise<number>): Promise<Pass> => {
    const c0 = process.cpuUsage();
    const p0 = pgCpuSeconds();
    const t0 = performance.now();
    const solveMs = await body();
    const wallMs = performance.now() - t0;
    const c = process.cpuUsage(c0);
    const p1 = pgCpuSeconds();
    return { wallMs, solveMs, cpuS: (c.user + c.system) / 1e6, pgCpuS: p0 === null || p1 === null ? null : p1 - p0 };
  };
  const engineAlone = () =>
    measure(async () => {
      let inSolver = 0;
      for (const c of cases) {
        const t1 = Date.now(); // as the driver times its solver calls
        await engineSolver(ctx, c, { onStart: () => {}, shouldStop: () => false });
        inSolver += Date.now() - t1;
      }
      return inSolver;
    });
  await engineAlone(); // warms the thread pool and the JIT, as a working worker is
  const passes: { driver: Pass; alone: Pass }[] = [];
  let run = probe;
  for (let round = 1; round <= rounds; round++) {
    // The order alternates from round to round, so that a change in load falls on both sides.
    const aloneFirst = round % 2 === 1;
    const first = aloneFirst ? await engineAlone() : null;
    run = await newRun(round === rounds ? config.name : `${config.name}, round ${round}`);
    const id = run.id;
    let outcome = '';
    const driver = await measure(async () => {
      outcome = await executeRun(id, { solve: engineSolver, workerId: 'bench' });
      return 0;
    });
    if (outcome !== 'finished') throw new Error(`the bench run ended ${outcome}: ${(await getRunById(run.id))?.error ?? ''}`);
    const rows = await listRunIntervals(run.id);
    driver.solveMs = 1000 * rows.reduce((a, r) => a + r.seconds, 0);
    const alone = first ?? (await engineAlone());
    passes.push({ driver, alone });
    console.log(
      `${tag} round ${round}: the run through the driver ${(driver.wallMs / 1000).toFixed(2)} s, the engine alone ${(alone.wallMs / 1000).toFixed(2)} s`,
    );
    if (PROBE) {
      // The driver with no database work during the day: data from memory, one write at the end.
      const quiet = await newRun(`${config.name}, quiet ${round}`);
      const byTime = new Map(cases.map((c) => [new Date(c.startsAt).getTime(), c]));
      const q = await measure(async () => {
        await executeRun(quiet.id, {
          solve: engineSolver,
          workerId: 'bench',
          writeEveryMs: 1e9,
          observe: async (_, t) => byTime.get(t.getTime())!,
        });
        return 0;
      });
      q.solveMs = 1000 * (await listRunIntervals(quiet.id)).reduce((a, r) => a + r.seconds, 0);
      console.log(
        `${tag} round ${round} probe: the driver without database work during the day ${(q.wallMs / 1000).toFixed(2)} s, its solver calls ${(q.solveMs / 1000).toFixed(2)} s; ` +
          `solver calls: driver ${(driver.solveMs / 1000).toFixed(2)} s, alone ${(alone.solveMs / 1000).toFixed(2)} s; driver ${cpu(driver)}; alone ${cpu(alone)}; quiet ${cpu(q)}`,
      );
    }
  }
  const extra = passes.map((p) => (100 * (p.driver.wallMs - p.alone.wallMs)) / p.alone.wallMs);
  const rows = await listRunIntervals(run.id);
  return { runId: run.id, passes, extra, rows, last: passes.at(-1)!.driver };
}

/**
 * (c)'s data loading on its own: the day's observations through the run's loader (16 intervals per
 * query, as the driver reads them), five times; per day the wall time, the CPU of this process and of
 * the database server, each as the median of the five.
 */
async function measureLoading(networkId: string, config: RunConfig): Promise<void> {
  const starts = Array.from({ length: INTERVALS }, (_, i) => new Date(new Date(config.data.from).getTime() + i * 600_000));
  const walls: number[] = [],
    cpus: number[] = [],
    pgs: number[] = [];
  let series = 0;
  for (let rep = 0; rep < 5; rep++) {
    const c0 = process.cpuUsage(),
      p0 = pgCpuSeconds(),
      t0 = performance.now();
    const load = intervalLoader(networkId, config, starts);
    series = 0;
    for (const t of starts) series += (await load(t)).observed.length;
    walls.push(performance.now() - t0);
    const c = process.cpuUsage(c0),
      p1 = pgCpuSeconds();
    cpus.push((c.user + c.system) / 1000);
    if (p0 !== null && p1 !== null) pgs.push(1000 * (p1 - p0));
  }
  console.log(
    `(c) loading the day's observations alone (${series} series, 16 intervals per query): median of 5 ${ms(median(walls))} wall, ` +
      `${ms(median(cpus))} CPU here (${ms(median(cpus) / INTERVALS)} per interval), ${pgs.length ? ms(median(pgs)) : '?'} in the database server (10 ms ticks)`,
  );
}

/** (c): the small problem; its solves are quick, so it shows the driver's fixed cost per interval. */
async function solveAndStore(networkId: string, userId: string, config: RunConfig): Promise<string> {
  const { runId, extra, rows, last, passes } = await driverAgainstEngine('(c)', networkId, userId, config, 3);
  console.log(
    `(c) the run through the driver takes a median ${median(extra).toFixed(2)} % longer than the engine alone ` +
      `(rounds: ${extra.map((x) => x.toFixed(1)).join(', ')} %; target <= 10 %)`,
  );
  const wallMs = last.wallMs;
  const solveMs = last.solveMs;
  console.log(
    `(c) last round, ${rows.length} intervals (${config.starts} starts each): ${(solveMs / 1000).toFixed(2)} s in the solver calls, ` +
      `${ms(wallMs - solveMs)} for everything else (claiming the run, its model and grid, loading data, writing results, progress) ` +
      `= ${((100 * (wallMs - solveMs)) / solveMs).toFixed(2)} % of solving = ${ms((wallMs - solveMs) / rows.length)} per interval (the driver's fixed cost)`,
  );
  const cx = cpuExtra(passes);
  console.log(
    `(c) CPU (this process and the database server): the driver a median ${median(cx).toFixed(2)} % more than the engine alone (rounds: ${cx.map((x) => x.toFixed(1)).join(', ')} %)`,
  );
  console.log(
    `(c) the solver calls themselves, median of the rounds: ${(median(passes.map((p) => p.driver.solveMs)) / 1000).toFixed(2)} s in the driver, ` +
      `${(median(passes.map((p) => p.alone.solveMs)) / 1000).toFixed(2)} s alone; last round ${cpu(last)}, alone ${cpu(passes.at(-1)!.alone)}`,
  );
  await measureLoading(networkId, config);
  // One result write on its own: the same rows written again under new interval times (a throwaway run).
  const { preview } = await (await import('@/src/runs/launch')).checkLaunch(networkId, config);
  const copy = await createRun({
    networkId,
    name: 'Bench copy',
    config: config as unknown as Record<string, unknown>,
    modelId: config.modelId,
    gridId: config.gridId,
    engineVersion: engineVersion(),
    intervalStarts: preview!.intervalStarts,
    startsPerInterval: config.starts,
    createdBy: userId,
  });
  const writes: number[] = [];
  for (const r of rows) {
    const t1 = performance.now();
    await saveRunInterval(copy.id, { startsAt: r.startsAt, nData: r.nData, result: r.result, seconds: r.seconds }, copy.progress);
    writes.push(performance.now() - t1);
  }
  const kb = rows.reduce((a, r) => a + Buffer.byteLength(JSON.stringify(r.result)), 0) / rows.length / 1024;
  console.log(
    `(c) one interval's result write: median ${ms(median(writes))} (${kb.toFixed(1)} KiB of JSON each) vs median solve ${ms(1000 * median(rows.map((r) => r.seconds)))}`,
  );
  return runId;
}

const DAY_BAND = { minHz: 5, maxHz: 40, stepHz: 0.25 };
// An invented layout (the inverter bench's): twelve sites over both hemispheres, not real ones.
const DAY_SITES = Array.from({ length: 12 }, (_, i) => ({
  code: `BD${String(i + 1).padStart(2, '0')}`,
  name: `Bench day site ${i + 1}`,
  latitude: -55 + ((i * 37) % 110),
  longitude: -170 + i * 29,
}));
const DAY_REGIONS = [
  { key: 'day-west', name: 'Western cell', colour: REGION_COLOURS[1], lat: { min: -25, max: 25 }, lon: { min: -90, max: -40 } },
  { key: 'day-middle', name: 'Middle cell', colour: REGION_COLOURS[5], lat: { min: -25, max: 25 }, lon: { min: -10, max: 40 } },
  { key: 'day-east', name: 'Eastern cell', colour: REGION_COLOURS[2], lat: { min: -25, max: 25 }, lon: { min: 90, max: 150 } },
];
/** Three regions drifting slowly over the day (t in [0, 1)), as in the inverter bench. */
const dayTruth = (t: number) => [
  { lat: -5 + 6 * t, lon: -62 + 10 * t, intensity: 3e4 * (1 + Math.sin(2 * Math.PI * t)) + 5e3 },
  { lat: 4 - 5 * t, lon: 18 + 8 * t, intensity: 4e4 * (1 + Math.cos(2 * Math.PI * t)) + 5e3 },
  { lat: 2 + 4 * t, lon: 118 - 12 * t, intensity: 2e4 * (1.2 + Math.sin(2 * Math.PI * (t + 0.3))) },
];

/** (c2)'s network: the inverter's day problem as stored spectra, in the same database as (a)–(c). */
export async function seedDay(userId: string): Promise<{ networkId: string; config: RunConfig }> {
  const network = await createNetwork('Bench day network', userId);
  const { config } = await seedSyntheticNetwork({
    ...benchSpec(network.id, userId, 'Bench day linear', 20310703),
    sites: DAY_SITES,
    grid: { name: 'Bench day cells', notes: '', cellSizeDeg: 10, regions: DAY_REGIONS.map(boxRegion) },
    band: DAY_BAND,
    starts: tenMinuteStarts(Date.UTC(2031, 6, 3, 0, 0, 0), DAY_INTERVALS),
    sources: (i) => dayTruth(i / 144),
    run: {
      name: 'Bench inverter day',
      regions: DAY_REGIONS.map((r) => ({ region: r.key, intensity: { min: 1e3, max: 1e6 }, lat: r.lat, lon: r.lon })),
      scaleCovariance: false,
      starts: DAY_STARTS,
      seed: 11,
    },
  });
  return { networkId: network.id, config };
}

/** (c2): the inverter's day problem through the driver against the engine alone. */
async function solveDay(userId: string): Promise<void> {
  const t0 = performance.now();
  const { networkId, config } = await seedDay(userId);
  const nData = 12 * 3 * bandFrequencies(DAY_BAND).length;
  console.log(
    `(c2) seeded ${DAY_INTERVALS} intervals x 12 stations x 3 components x ${bandFrequencies(DAY_BAND).length} bins (${nData} data per interval), ` +
      `3 moving regions (9 parameters), ${DAY_STARTS} starts, in ${((performance.now() - t0) / 1000).toFixed(1)} s; load average ${loadavg()
        .map((x) => x.toFixed(1))
        .join(' ')}`,
  );
  const { extra, rows, passes } = await driverAgainstEngine('(c2)', networkId, userId, config, DAY_ROUNDS);
  const mid = (pick: (p: { driver: Pass; alone: Pass }) => number) => median(passes.map(pick));
  console.log(
    `(c2) the run through the driver ${(mid((p) => p.driver.wallMs) / 1000).toFixed(2)} s, the engine alone ${(mid((p) => p.alone.wallMs) / 1000).toFixed(2)} s (medians of ${passes.length} rounds); ` +
      `the driver takes a median ${median(extra).toFixed(2)} % longer (rounds: ${extra.map((x) => x.toFixed(1)).join(', ')} %; target <= 10 %)`,
  );
  const cx = cpuExtra(passes);
  console.log(
    `(c2) CPU (this process and the database server): the driver a median ${median(cx).toFixed(2)} % more than the engine alone (rounds: ${cx.map((x) => x.toFixed(1)).join(', ')} %)`,
  );
  const outside = passes.map((p) => (p.driver.wallMs - p.driver.solveMs) / rows.length);
  console.log(
    `(c2) outside the solver calls: median ${ms(median(outside))} per interval (rounds: ${outside.map((x) => x.toFixed(2)).join(', ')} ms) ` +
      `= ${((100 * median(passes.map((p) => p.driver.wallMs - p.driver.solveMs))) / mid((p) => p.driver.solveMs)).toFixed(2)} % of solving`,
  );
  console.log(
    `(c2) the solver calls themselves: ${(mid((p) => p.driver.solveMs) / 1000).toFixed(2)} s in the driver, ${(mid((p) => p.alone.solveMs) / 1000).toFixed(2)} s alone ` +
      `(median ${ms(1000 * median(rows.map((r) => r.seconds)))} per interval); CPU per round: ${passes.map((p) => `driver ${cpu(p.driver)} / alone ${cpu(p.alone)}`).join('; ')}`,
  );
  const perDay = (x: number) => (x / 1000) * (144 / rows.length);
  const budget = DAY_TARGET_S * (1 + STORING_SHARE);
  const dayS = perDay(mid((p) => p.driver.wallMs));
  console.log(
    `(c2) the day through the driver${rows.length === 144 ? '' : ` (scaled to 144 intervals from ${rows.length})`}: ${dayS.toFixed(1)} s ` +
      `against ${DAY_TARGET_S} s + ${100 * STORING_SHARE} % = ${budget.toFixed(0)} s: ${dayS <= budget ? 'within' : 'OVER'}; ` +
      `engine alone ${perDay(mid((p) => p.alone.wallMs)).toFixed(1)} s; load average ${loadavg()
        .map((x) => x.toFixed(1))
        .join(' ')}`,
  );
}

async function measureView(networkId: string, runId: string): Promise<void> {
  const times: number[] = [];
  for (let i = 0; i < 11; i++) {
    const t0 = performance.now();
    await getRunView(networkId, runId);
    times.push(performance.now() - t0);
  }
  times.shift();
  const kb = Buffer.byteLength(JSON.stringify(await getRunView(networkId, runId))) / 1024;
  console.log(
    `(b) getRunView of a finished ${INTERVALS}-interval, three-region run: median ${ms(median(times))} of ${times.length} (${kb.toFixed(0)} KiB as JSON)`,
  );
}

/** The first view's figures, each drawn (its svg in the document) — see measurePage. */
const FIGURES = [
  'svg[aria-label="Regional intensity through the day"]',
  'svg[aria-label="Correlation matrix of the parameters"]',
  'svg[aria-label^="Where the "]',
  'svg[aria-label^="Power at "]',
  'svg[aria-label="Weighted residuals"]',
];
const MAP_TITLE = 'Source regions of the selected minimum';

/**
 * Installed in the page before its HTML arrives: notes (in the page's own clock, from the start of
 * navigation) when the first frame with every figure in the document has been painted — the map (its svg's
 * title) and FIGURES — and when the frame with every Plot figure live has (`data-drawn="client"`, none left from the
 * server). Timed inside the page, because a check from outside waits for the page's busy main thread.
 * A string, not a function: the bench's own compiler would wrap inner functions in helpers the page lacks.
 */
const WATCH_FIGURES = `(() => {
  const figures = ${JSON.stringify(FIGURES)};
  const mapTitle = ${JSON.stringify(MAP_TITLE)};
  const times = window.figureTimes = {};
  // The frame after the next: that next frame, the first with the change, has been painted by then.
  const painted = (done) => requestAnimationFrame(() => requestAnimationFrame(done));
  const all = () => figures.every((f) => document.querySelector(f))
    && [...document.querySelectorAll('svg > title')].some((t) => t.textContent === mapTitle);
  const liveNow = () => document.querySelectorAll('[data-drawn="server"]').length === 0
    && document.querySelectorAll('[data-drawn="client"]').length >= figures.length;
  const observer = new MutationObserver(() => {
    if (times.drawn === undefined && all()) { times.drawn = -1; painted((t) => { times.drawn = t; }); }
    if (times.live === undefined && liveNow()) { times.live = -1; painted((t) => { times.live = t; }); }
    if (times.drawn !== undefined && times.live !== undefined) observer.disconnect();
  });
  observer.observe(document, { childList: true, subtree: true, attributes: true, attributeFilter: ['data-drawn'] });
})();`;

async function measurePage(
  databaseUrl: string,
  networkId: string,
  userId: string,
  runId: string,
  stop: Array<() => Promise<void> | void>,
): Promise<void> {
  if (!hasProductionBuild()) {
    console.log(
      '(b) page load: skipped — no production build in .next (build with `npm run build` or `npm start`, then run again)',
    );
    return;
  }
  const { base, stale } = await startNextServer(databaseUrl, stop);
  const cookie = await startSession(userId);
  const value = /^[^=]+=([^;]*)/.exec(cookie)?.[1] ?? '';
  const browser = await launchBrowser();
  stop.push(() => browser.close());
  const context = await browser.newContext();
  await context.addCookies([{ name: SESSION_COOKIE, value, url: base }]);
  const url = `${base}/n/${networkId}/runs/${runId}`;
  const drawn: number[] = [];
  const live: number[] = [];
  const server: { first: number; last: number; dcl: number; fcp: number }[] = [];
  let sizes = { html: 0, js: 0, chunks: 0 };
  await context.addInitScript(WATCH_FIGURES);
  for (let i = 0; i < 6; i++) {
    const page = await context.newPage();
    await page.goto(url, { waitUntil: 'commit' });
    const t = await page
      .waitForFunction(
        () => {
          const f = (window as unknown as { figureTimes?: { drawn?: number; live?: number } }).figureTimes;
          return f && (f.drawn ?? -1) >= 0 && (f.live ?? -1) >= 0 ? f : null;
        },
        undefined,
        { timeout: 60_000, polling: 100 },
      )
      .then((h) => h.jsonValue() as Promise<{ drawn: number; live: number }>);
    drawn.push(t.drawn);
    live.push(t.live);
    const nav = await page.evaluate(() => {
      const n = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
      const fcp = performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN;
      return {
        first: n.responseStart - n.requestStart,
        last: n.responseEnd - n.requestStart,
        dcl: n.domContentLoadedEventEnd - n.requestStart,
        fcp: fcp - n.requestStart,
      };
    });
    server.push(nav);
    if (i === 5) {
      sizes = await page.evaluate(() => {
        const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
        const scripts = performance
          .getEntriesByType('resource')
          .filter((e) => (e as PerformanceResourceTiming).initiatorType === 'script' || e.name.endsWith('.js'));
        return {
          html: nav.decodedBodySize,
          js: scripts.reduce((a, e) => a + (e as PerformanceResourceTiming).decodedBodySize, 0),
          chunks: scripts.length,
        };
      });
    }
    await page.close();
  }
  // the first load warms the server
  for (const xs of [drawn, live, server]) xs.shift();
  const at = (pick: (x: (typeof server)[number]) => number) => ms(median(server.map(pick)));
  console.log(
    `(b) run page, from the request: first byte of HTML (server rendering) median ${at((x) => x.first)}, ` +
      `last byte ${at((x) => x.last)}, first contentful paint ${at((x) => x.fcp)}, DOMContentLoaded ${at((x) => x.dcl)} ` +
      `(${(sizes.html / 1024).toFixed(0)} KiB of HTML; ${(sizes.js / 1024).toFixed(0)} KiB of JavaScript in ${sizes.chunks} chunks)`,
  );
  const note = stale.stale ? ' — note: the build in .next is older than the sources' : '';
  console.log(
    `(b) run page in headless chromium until every figure is drawn (map, series, correlations, starts, fitted spectrum, residuals): ` +
      `median ${ms(median(drawn))} of ${drawn.length} (target < 1 s)${note}`,
  );
  console.log(
    `(b) run page until every figure is live (redrawn by the browser, hover tips): median ${ms(median(live))} of ${live.length}`,
  );
}

export default async function main(): Promise<void> {
  const stop: Array<() => Promise<void> | void> = [];
  let pg: ThrowawayPg | null = null;
  const previousUrl = settings().DATABASE_URL;
  try {
    pg = await startThrowawayPostgres();
    setEnv('DATABASE_URL', pg.url);
    await migrate(pg.url);
    const t0 = performance.now();
    const { userId, networkId, config } = await seed();
    console.log(
      `seeded ${INTERVALS} intervals x 3 stations x 3 components of synthetic spectra in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
    await measureLaunch(networkId, userId, config);
    const runId = await solveAndStore(networkId, userId, config);
    if (!BENCH.BENCH_RUN_DAY) console.log("(c2) the inverter's day through the driver: skipped (BENCH_RUN_DAY=0)");
    else await solveDay(userId);
    await measureView(networkId, runId);
    if (!BENCH.BENCH_RUN_PAGE) console.log('(b) page load: skipped (BENCH_RUN_PAGE=0)');
    else await measurePage(pg.url, networkId, userId, runId, stop);
  } finally {
    await tearDownBench(stop, pg, previousUrl);
  }
}
