/**
 * Run measurements (no pass/fail), on a throwaway PostgreSQL of its own:
 *  (a) launching — median wall time of `launchRun` (the service the POST route calls) over a
 *      day of 144 intervals, three stations x three components;
 *  (b) the run page — median of `getRunView` (the page's server data), and, when a production
 *      build exists in .next, the full page load in headless chromium until the map, the
 *      series curves, the correlation matrix and a fitted spectrum are drawn;
 *  (c) storing results — the time `saveRunInterval` takes for the 144 solved intervals as a
 *      share of the time the engine took to solve them.
 * Every server, browser and database it starts is stopped at the end, also on error.
 * Run with `npm run bench -- runs`. BENCH_RUN_INTERVALS (default 144) and BENCH_RUN_STARTS
 * (default 16, as the launch form) scale it down or up.
 */
import { randomUUID } from 'node:crypto';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { startThrowawayPostgres, freePort, type ThrowawayPg } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { closeDatabase } from '@/db/lifecycle';
import { stopBoss } from '@/db/jobs';
import { insertUser } from '@/db/repo/users';
import { createNetwork } from '@/db/repo/networks';
import { createStation, type Station } from '@/db/repo/stations';
import { saveIntervals } from '@/db/repo/intervals';
import { createRun, endRun, saveRunInterval, type RunProgress } from '@/db/repo/runs';
import { predictSpectra } from '@/src/engine/forward/predict';
import { saveGrid, saveModel } from '@/src/runs/catalogue';
import type { RunConfig } from '@/src/runs/config';
import { launchRun } from '@/src/runs/launch';
import { getRunView } from '@/src/runs/results';
import { loadRunContext } from '@/src/runs/context';
import { loadIntervalObservations } from '@/src/runs/observations';
import { engineSolver } from '@/src/runs/solver';
import { engineVersion } from '@/src/runs/engine-version';
import { startSession } from '@/src/auth/session';
import { SESSION_COOKIE } from '@/src/auth/lucia';
import { nextBin, projectRoot } from '@/src/ops/paths';
import { waitForHttp } from '@/src/ops/supervisor';
import { buildStaleness, holdSharedBuildLock } from '@/src/ops/build';
import { launchBrowser } from '@/src/ops/browser';

const INTERVALS = Number(process.env.BENCH_RUN_INTERVALS) > 0 ? Number(process.env.BENCH_RUN_INTERVALS) : 144;
const STARTS = Number(process.env.BENCH_RUN_STARTS) > 0 ? Number(process.env.BENCH_RUN_STARTS) : 16; // the launch form's default
const CAVITY = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
const BAND = { minHz: 6, maxHz: 30, stepHz: 0.5 };
// An invented scenario: three huts and three source regions, not real sites.
const SITES = [
  { code: 'BR1', name: 'Bench hut north', latitude: 52.1, longitude: 12.4 },
  { code: 'BR2', name: 'Bench hut south', latitude: -33.2, longitude: 146.8 },
  { code: 'BR3', name: 'Bench hut west', latitude: 38.6, longitude: -104.2 },
];
const SOURCES = [{ lat: -2, lon: 24, intensity: 3e4 }, { lat: -5, lon: -50, intensity: 2e4 }, { lat: -5, lon: 120, intensity: 1.5e4 }];

const median = (xs: number[]) => { const s = [...xs].sort((a, b) => a - b); const n = s.length; return n % 2 ? s[(n - 1) / 2] : (s[n / 2 - 1] + s[n / 2]) / 2; };
const ms = (x: number) => `${x.toFixed(x < 10 ? 2 : 0)} ms`;

async function seed() {
  const userId = `bench-${randomUUID()}`;
  await insertUser({ id: userId, email: `${userId}@example.test`, name: 'Bench analyst', passwordHash: 'x' });
  const network = await createNetwork('Bench network', userId);
  const stations: Station[] = [];
  for (const s of SITES) {
    stations.push(await createStation(network.id, {
      ...s, elevationM: 200, mainsHz: 50, interferenceLines: [], sampleRateHz: 200, notes: '', status: 'operating',
      components: (['Ez', 'Bns', 'Bew'] as const).map((component) => ({ component, calibration: { kind: 'gain' as const, gain: 1 } })),
    }));
  }
  const model = await saveModel(network.id, userId, { name: 'Bench linear', notes: '', config: CAVITY });
  const grid = await saveGrid(network.id, userId, {
    name: 'Bench belts', notes: '', cellSizeDeg: 10,
    regions: [
      { key: 'africa-belt', name: 'Eastern belt', colour: '#E69F00', kind: 'moving', centre: { lat: 0, lon: 20 }, bounds: { lat: { min: -20, max: 20 }, lon: { min: 0, max: 40 } }, spreadDeg: 0 },
      { key: 'america-belt', name: 'Western belt', colour: '#56B4E9', kind: 'cells', cells: [300, 301] },
      { key: 'asia-belt', name: 'Far eastern belt', colour: '#009E73', kind: 'cells', cells: [317, 318] },
    ],
  });
  const spectra = predictSpectra({
    cavity: CAVITY, band: BAND,
    stations: stations.map((s) => ({ code: s.code, lat: s.latitude, lon: s.longitude, components: ['Ez', 'Bns', 'Bew'] as const })),
    sources: SOURCES,
  });
  const day = Date.UTC(2031, 6, 2, 0, 0, 0);
  const starts = Array.from({ length: INTERVALS }, (_, i) => new Date(day + i * 600_000));
  await saveIntervals(starts.flatMap((t) => spectra.map((sp) => ({
    networkId: network.id, stationId: stations.find((s) => s.code === sp.station)!.id, component: sp.component,
    startsAt: t, durationS: 600, origin: 'synthetic' as const, uploadId: null, rejectedShare: 0, qualityFlags: [],
    spectrum: { frequencies: sp.frequencies, power: sp.power, segments: 100 }, fit: null,
  }))));
  const config: RunConfig = {
    name: 'Bench day', modelId: model.id, gridId: grid.id,
    data: { stationIds: stations.map((s) => s.id), components: ['Ez', 'Bns', 'Bew'], from: starts[0].toISOString(), to: starts.at(-1)!.toISOString(), includeFlagged: false },
    observables: { kind: 'spectrum', minHz: BAND.minHz, maxHz: BAND.maxHz, every: 1 },
    regions: [
      { region: 'africa-belt', intensity: { min: 1e2, max: 1e6 }, lat: { min: -15, max: 15 }, lon: { min: 5, max: 35 } },
      { region: 'america-belt', intensity: { min: 1e2, max: 1e6 } },
      { region: 'asia-belt', intensity: { min: 1e2, max: 1e6 } },
    ],
    damping: { initialLambda: 1e-2, maxIterations: 200, scaleCovariance: false },
    starts: STARTS, seed: 11,
  };
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
  console.log(`(a) launchRun, ${INTERVALS} intervals x 3 stations x 3 components: median ${ms(median(times))} of ${times.length} (target < 200 ms)`);
}

/** Solves every interval with the engine, stores each result, and ends the run as finished. */
async function solveAndStore(networkId: string, userId: string, config: RunConfig): Promise<string> {
  const { checkLaunch } = await import('@/src/runs/launch');
  const { preview } = await checkLaunch(networkId, config);
  const run = await createRun({
    networkId, name: config.name, config: config as unknown as Record<string, unknown>, modelId: config.modelId, gridId: config.gridId,
    engineVersion: engineVersion(), intervalStarts: preview!.intervalStarts, startsPerInterval: config.starts, createdBy: userId,
  });
  const ctx = await loadRunContext(run);
  const progress: RunProgress = { ...run.progress, phase: 'bench' };
  let solveMs = 0;
  let storeMs = 0;
  for (const [i, startsAt] of run.intervalStarts.entries()) {
    const obs = await loadIntervalObservations(networkId, config, new Date(startsAt));
    const t0 = performance.now();
    const out = await engineSolver(ctx, { startsAt, ...obs }, { onStart: () => {}, shouldStop: () => false });
    const t1 = performance.now();
    if (out === 'cancelled') throw new Error('the solver stopped unexpectedly');
    progress.intervalsDone = i + 1;
    await saveRunInterval(run.id, { startsAt: new Date(startsAt), nData: out.nData, result: out.result, seconds: (t1 - t0) / 1000 }, { ...progress });
    solveMs += t1 - t0;
    storeMs += performance.now() - t1;
  }
  await endRun(run.id, 'finished', { ...progress, phase: 'finished', etaSeconds: 0 });
  console.log(`(c) storing ${run.intervalStarts.length} interval results: ${ms(storeMs)} vs solving them: ${(solveMs / 1000).toFixed(1)} s `
    + `(${config.starts} starts each) = ${((100 * storeMs) / solveMs).toFixed(2)} % (target <= 10 %)`);
  return run.id;
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
  console.log(`(b) getRunView of a finished ${INTERVALS}-interval, three-region run: median ${ms(median(times))} of ${times.length} (${kb.toFixed(0)} KiB as JSON)`);
}

async function measurePage(databaseUrl: string, networkId: string, userId: string, runId: string, stop: Array<() => Promise<void> | void>): Promise<void> {
  if (!existsSync(path.join(projectRoot, '.next', 'BUILD_ID'))) {
    console.log('(b) page load: skipped — no production build in .next (build with `npm run build` or `npm start`, then run again)');
    return;
  }
  const stale = buildStaleness();
  const release = await holdSharedBuildLock(); // no build replaces .next while we serve it
  stop.push(release);
  const port = await freePort();
  const { NODE_ENV: _n, ...inherited } = process.env;
  const web: ChildProcess = spawn(process.execPath, [nextBin, 'start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: projectRoot, stdio: ['ignore', 'ignore', 'pipe'],
    env: { ...inherited, DATABASE_URL: databaseUrl, PORT: String(port), APP_URL: `http://127.0.0.1:${port}`, COOKIE_SECURE: 'false', NEXT_TELEMETRY_DISABLED: '1' } as unknown as NodeJS.ProcessEnv,
  });
  stop.push(() => new Promise<void>((resolve) => {
    if (web.exitCode !== null || web.signalCode !== null) return resolve();
    web.once('exit', () => resolve());
    web.kill('SIGTERM');
  }));
  const base = `http://127.0.0.1:${port}`;
  await waitForHttp(`${base}/`, 60_000, () => web.exitCode === null);
  const cookie = await startSession(userId);
  const value = /^[^=]+=([^;]*)/.exec(cookie)?.[1] ?? '';
  const browser = await launchBrowser();
  stop.push(() => browser.close());
  const context = await browser.newContext();
  await context.addCookies([{ name: SESSION_COOKIE, value, url: base }]);
  const url = `${base}/n/${networkId}/runs/${runId}`;
  const times: number[] = [];
  const firstFigures: number[] = [];
  const html: number[] = [];
  for (let i = 0; i < 6; i++) {
    const page = await context.newPage();
    const t0 = performance.now();
    await page.goto(url, { waitUntil: 'domcontentloaded' });
    html.push(performance.now() - t0);
    await page.locator('svg title', { hasText: 'Source regions of the selected minimum' }).waitFor({ state: 'attached', timeout: 60_000 });
    await page.getByText('Regional intensity through the day').first().waitFor({ timeout: 60_000 });
    await page.getByText('Correlation matrix of the parameters').first().waitFor({ timeout: 60_000 });
    firstFigures.push(performance.now() - t0);
    await page.getByText(/^Power at /).first().waitFor({ timeout: 60_000 }); // the fits come from a second request
    times.push(performance.now() - t0);
    await page.close();
  }
  times.shift(); // the first load warms the server
  firstFigures.shift();
  html.shift();
  console.log(`(b) run page: server-rendered HTML received and parsed after a median ${ms(median(html))} of ${html.length}`);
  const note = stale.stale ? ' — note: the build in .next is older than the sources' : '';
  console.log(`(b) run page in headless chromium until map, series and correlations are drawn: median ${ms(median(firstFigures))} of ${firstFigures.length}${note}`);
  console.log(`(b) run page until the fitted spectra are drawn too (every figure): median ${ms(median(times))} of ${times.length} (target < 1 s)`);
}

export default async function main(): Promise<void> {
  const stop: Array<() => Promise<void> | void> = [];
  let pg: ThrowawayPg | null = null;
  const previousUrl = process.env.DATABASE_URL;
  try {
    pg = await startThrowawayPostgres();
    process.env.DATABASE_URL = pg.url;
    await migrate(pg.url);
    const t0 = performance.now();
    const { userId, networkId, config } = await seed();
    console.log(`seeded ${INTERVALS} intervals x 3 stations x 3 components of synthetic spectra in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    await measureLaunch(networkId, userId, config);
    const runId = await solveAndStore(networkId, userId, config);
    await measureView(networkId, runId);
    await measurePage(pg.url, networkId, userId, runId, stop);
  } finally {
    for (const s of stop.reverse()) await Promise.resolve().then(s).catch(() => {});
    await stopBoss(5_000).catch(() => {});
    await closeDatabase().catch(() => {});
    await pg?.stop().catch(() => {});
    if (previousUrl === undefined) delete process.env.DATABASE_URL; else process.env.DATABASE_URL = previousUrl;
  }
}
