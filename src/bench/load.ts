/**
 * `npm run bench -- load`: simulated users against a production server (`next start`) on loopback.
 * Seeds a throwaway PostgreSQL with a network holding a long run (144 intervals x 256 starts, the
 * size of a full day with many starts; results made up by `largeResult`) and more runs for the
 * list, then lets LOAD_USERS users (default 50), each signed in with a session of its own, ask in
 * turn for the network overview, the run list and the run API (its summary), LOAD_ROUNDS times
 * each (default 10), reading each answer LOAD_THINK_MS on average (default 1000; 0 for back-to-back
 * requests), for at most LOAD_SECONDS (default 120). Prints p50/p95/max per address
 * (goal: p95 under 300 ms on the 2-core machine), and the run page and the run API alone, one
 * request at a time. Measurements only; nothing passes or fails. Needs a production build in .next.
 */
import { randomUUID } from 'node:crypto';
import { loadavg } from 'node:os';
import { startThrowawayPostgres, type ThrowawayPg } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { insertUser } from '@/db/repo/users';
import { createNetwork, upsertMembership } from '@/db/repo/networks';
import { createRun, endRun, saveRunIntervals } from '@/db/repo/runs';
import { engineVersion } from '@/src/runs/engine-version';
import { startSession } from '@/src/auth/session';
import { setEnv, settings } from '@/src/settings';
import { hasProductionBuild, startNextServer } from './next-server';
import { tearDownBench } from './teardown';
import { boxRegion, seedSyntheticNetwork, tenMinuteStarts } from '@/src/runs/synthetic-network';
import { largeResult } from './large-result';

const INTERVALS = 144;
const STARTS = 256;
const OTHER_RUNS = 24;
const REGIONS = [
  { key: 'west-cell', name: 'West cell', colour: '#E69F00', lat: { min: -25, max: 25 }, lon: { min: -90, max: -40 } },
  { key: 'middle-cell', name: 'Middle cell', colour: '#56B4E9', lat: { min: -25, max: 25 }, lon: { min: -10, max: 40 } },
  { key: 'east-cell', name: 'East cell', colour: '#009E73', lat: { min: -25, max: 25 }, lon: { min: 90, max: 150 } },
];

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.ceil(q * s.length) - 1)] : NaN;
};
const ms = (x: number) => `${x.toFixed(0)} ms`;

/** A network with three invented huts, a model, a grid, the long run and OTHER_RUNS short ones. */
async function seedNetwork(userId: string): Promise<{ networkId: string; runId: string }> {
  const network = await createNetwork('Load bench network', userId);
  const day = Date.UTC(2031, 6, 3);
  // No spectra: the runs' results are made up, so only the stations, model, grid and configuration are needed.
  const { model, grid, config } = await seedSyntheticNetwork({
    networkId: network.id,
    userId,
    sites: Array.from({ length: 3 }, (_, i) => ({
      code: `LB${i + 1}`,
      name: `Load bench hut ${i + 1}`,
      latitude: -40 + 35 * i,
      longitude: -150 + 110 * i,
    })),
    components: ['Ez', 'Bns', 'Bew'],
    elevationM: 100,
    model: { name: 'Load linear', cavity: { model: 'linear', earthRadiusKm: 6371, heightKm: 60 } },
    grid: { name: 'Load cells', notes: '', cellSizeDeg: 10, regions: REGIONS.map(boxRegion) },
    band: { minHz: 5, maxHz: 40, stepHz: 0.25 },
    starts: tenMinuteStarts(day, INTERVALS),
    run: {
      name: 'Load long run',
      regions: REGIONS.map((r) => ({ region: r.key, intensity: { min: 1e3, max: 1e6 }, lat: r.lat, lon: r.lon })),
      scaleCovariance: false,
      starts: STARTS,
      seed: 5,
    },
  });
  const names = REGIONS.map((r) => r.name);
  const store = async (name: string, count: number, starts: number) => {
    const run = await createRun({
      networkId: network.id,
      name,
      config: { ...config, name, starts } as unknown as Record<string, unknown>,
      modelId: model.id,
      gridId: grid.id,
      engineVersion: engineVersion(),
      intervalStarts: Array.from({ length: count }, (_, i) => new Date(day + i * 600_000).toISOString()),
      startsPerInterval: starts,
      createdBy: userId,
    });
    for (let i0 = 0; i0 < count; i0 += 12) {
      const entries = Array.from({ length: Math.min(12, count - i0) }, (_, j) => ({
        startsAt: new Date(day + (i0 + j) * 600_000),
        nData: 3000,
        seconds: 1,
        result: largeResult({ regions: names, starts, minima: 8, seed: i0 + j + 1 }) as unknown as Record<string, unknown>,
      }));
      await saveRunIntervals(run.id, entries, run.progress);
    }
    await endRun(run.id, 'finished', { ...run.progress, intervalsDone: count, intervalsTotal: count });
    return run.id;
  };
  const runId = await store('Load long run', INTERVALS, STARTS);
  for (let k = 0; k < OTHER_RUNS; k++) await store(`Load short run ${k + 1}`, 6, 16);
  return { networkId: network.id, runId };
}

async function timed(url: string, cookie: string): Promise<{ ms: number; status: number; bytes: number }> {
  const t0 = performance.now();
  const res = await fetch(url, { headers: { cookie }, redirect: 'manual' });
  const body = await res.arrayBuffer();
  return { ms: performance.now() - t0, status: res.status, bytes: body.byteLength };
}

export default async function main(): Promise<void> {
  if (!hasProductionBuild()) {
    console.log('load: skipped — no production build in .next (build with `npm run build` or `npm start`, then run again)');
    return;
  }
  const s = settings();
  const users = s.LOAD_USERS;
  const rounds = s.LOAD_ROUNDS;
  const think = s.LOAD_THINK_MS;
  const stop: Array<() => Promise<void> | void> = [];
  let pg: ThrowawayPg | null = null;
  const previousUrl = settings().DATABASE_URL;
  try {
    pg = await startThrowawayPostgres();
    setEnv('DATABASE_URL', pg.url);
    await migrate(pg.url);
    const t0 = performance.now();
    const ownerId = `load-${randomUUID()}`;
    await insertUser({ id: ownerId, email: `${ownerId}@example.test`, name: 'Load owner', passwordHash: 'x' });
    const { networkId, runId } = await seedNetwork(ownerId);
    const cookies: string[] = [];
    for (let u = 0; u < users; u++) {
      const id = `load-${randomUUID()}`;
      await insertUser({ id, email: `${id}@example.test`, name: `Load user ${u + 1}`, passwordHash: 'x' });
      await upsertMembership(networkId, id, 'viewer');
      cookies.push((await startSession(id)).split(';')[0]);
    }
    console.log(
      `seeded a ${INTERVALS}-interval x ${STARTS}-start run, ${OTHER_RUNS} short runs and ${users} users in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );

    const { base, stale } = await startNextServer(pg.url, stop);
    const targets = {
      overview: `${base}/n/${networkId}`,
      'run list': `${base}/n/${networkId}/runs`,
      'run API': `${base}/api/networks/${networkId}/runs/${runId}`,
    };
    // Warm up: each address once (first requests load their code).
    for (const url of [...Object.values(targets), `${base}/n/${networkId}/runs/${runId}`]) {
      const r = await timed(url, cookies[0]);
      if (r.status !== 200) throw new Error(`${url} answered ${r.status} while warming up`);
    }

    // One request at a time: the run page (HTML) and the run API, summary and in full.
    const alone = async (url: string, n = 7) => {
      const xs: number[] = [];
      let bytes = 0;
      for (let i = 0; i < n; i++) {
        const r = await timed(url, cookies[0]);
        xs.push(r.ms);
        bytes = r.bytes;
      }
      return { median: quantile(xs, 0.5), kb: bytes / 1024 };
    };
    const overview = await alone(targets.overview);
    const list = await alone(targets['run list']);
    console.log(
      `alone: overview ${ms(overview.median)} (${overview.kb.toFixed(0)} KiB), run list ${ms(list.median)} (${list.kb.toFixed(0)} KiB) — medians`,
    );
    const page = await alone(`${base}/n/${networkId}/runs/${runId}`);
    const summary = await alone(targets['run API']);
    const full = await alone(`${targets['run API']}?detail=full`, 3);
    console.log(
      `alone: run page ${ms(page.median)} to its last byte (${page.kb.toFixed(0)} KiB of HTML); run API summary ${ms(summary.median)} ` +
        `(${summary.kb.toFixed(0)} KiB) against the whole run ${ms(full.median)} (${(full.kb / 1024).toFixed(1)} MiB) — medians`,
    );

    const times: Record<string, number[]> = Object.fromEntries(Object.keys(targets).map((k) => [k, []]));
    const failures: string[] = [];
    const until = performance.now() + s.LOAD_SECONDS * 1000;
    const t1 = performance.now();
    await Promise.all(
      cookies.map(async (cookie, u) => {
        const order = Object.entries(targets);
        for (let r = 0; r < rounds && performance.now() < until; r++) {
          // Each user starts at another address, so the mix is even from the first second.
          for (let k = 0; k < order.length; k++) {
            const [name, url] = order[(k + u) % order.length];
            const res = await timed(url, cookie).catch((e: Error) => ({ ms: NaN, status: 0, bytes: 0, error: e.message }));
            if (res.status !== 200) failures.push(`${name}: ${res.status}`);
            else times[name].push(res.ms);
            // A person reads before the next click: THINK ms on average (uniform, ±50 %).
            await new Promise((r) => setTimeout(r, think * (0.5 + Math.random())));
          }
        }
      }),
    );
    const wall = (performance.now() - t1) / 1000;
    const total = Object.values(times).reduce((a, xs) => a + xs.length, 0);
    console.log(
      `${users} users x ${rounds} rounds x 3 addresses, ${think} ms to read each answer: ${total} answers in ${wall.toFixed(1)} s (${(total / wall).toFixed(0)}/s)` +
        `${failures.length ? `, ${failures.length} failed (${[...new Set(failures)].slice(0, 3).join('; ')})` : ''}; load average ${loadavg()
          .map((x) => x.toFixed(1))
          .join(' ')}`,
    );
    console.log('| address | answers | p50 | p95 | max | goal p95 |');
    console.log('|---|---|---|---|---|---|');
    for (const [name, xs] of Object.entries(times)) {
      const p95 = quantile(xs, 0.95);
      console.log(
        `| ${name} | ${xs.length} | ${ms(quantile(xs, 0.5))} | ${ms(p95)} | ${ms(Math.max(...xs))} | < 300 ms: ${p95 < 300 ? 'met' : 'NOT met'} |`,
      );
    }
    if (stale.stale) console.log(`note: the build in .next is older than the sources (${stale.reason})`);
  } finally {
    await tearDownBench(stop, pg, previousUrl);
  }
}
