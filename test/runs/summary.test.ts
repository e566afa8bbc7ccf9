/**
 * The run summary the run page and the run API send first: every interval's best minimum (misfit,
 * start count, sources and their errors) and counts, cut down in the database, with the
 * interval the page opens on (the last solved one) whole; any other interval whole on demand.
 * Checked against the stored results themselves, on a run of the size a long run makes
 * (48 intervals of 256 starts here; the load benchmark uses 144).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { call, errorOf, makeUser } from '@/test/helpers/authz';
import { upsertMembership } from '@/db/repo/networks';
import { createRun, saveRunIntervals } from '@/db/repo/runs';
import { getIntervalView, getRunSummary, getRunView } from '@/src/runs/results';
import { engineVersion } from '@/src/runs/engine-version';
import { largeResult } from '@/src/bench/large-result';
import type { InversionResult } from '@/src/engine/inverse/types';
import * as runRoute from '@/app/api/networks/[networkId]/runs/[runId]/route';
import { makeRunWorld } from './world';

const INTERVALS = 48;
let world: Awaited<ReturnType<typeof makeRunWorld>>;
let runId = '';
const stored: { startsAt: Date; result: InversionResult | { skipped: string } }[] = [];

beforeAll(async () => {
  await resetDatabase();
  world = await makeRunWorld(1);
  const t0 = Date.UTC(2031, 4, 12, 0, 0, 0);
  const starts = Array.from({ length: INTERVALS }, (_, i) => new Date(t0 + i * 600_000));
  const run = await createRun({
    networkId: world.networkId,
    name: 'Long run',
    config: world.config as unknown as Record<string, unknown>,
    modelId: world.model.id,
    gridId: world.grid.id,
    engineVersion: engineVersion(),
    intervalStarts: starts.map((t) => t.toISOString()),
    startsPerInterval: 256,
    createdBy: world.userId,
  });
  runId = run.id;
  for (const [i, t] of starts.entries()) {
    // The last interval had no data: the one the page opens on is the one before.
    const result =
      i === INTERVALS - 1
        ? { skipped: 'no spectra in this interval' }
        : largeResult({ regions: ['A', 'B', 'C'], starts: 256, minima: 8, seed: i + 1 });
    stored.push({ startsAt: t, result });
  }
  await saveRunIntervals(
    run.id,
    stored.map((s) => ({
      startsAt: s.startsAt,
      nData: 3000,
      seconds: 1,
      result: s.result as unknown as Record<string, unknown>,
    })),
    run.progress,
  );
});
afterAll(closeDatabase);

describe('run summary', () => {
  it('holds each interval’s best minimum (misfit, count, sources, errors), its counts, and the opening interval whole', async () => {
    const summary = await getRunSummary(world.networkId, runId);
    // The whole run as shown (errors as the run states them), interval by interval.
    const whole = (await getRunView(world.networkId, runId)).intervals;
    expect(summary.intervals).toHaveLength(INTERVALS);
    const openAt = stored[INTERVALS - 2].startsAt.toISOString();
    for (const [i, iv] of summary.intervals.entries()) {
      const s = stored[i];
      expect(iv.startsAt).toBe(s.startsAt.toISOString());
      if ('skipped' in s.result) {
        expect(iv).toMatchObject({ result: null, skipped: s.result.skipped });
        continue;
      }
      if (iv.startsAt === openAt) {
        expect(iv.brief).toBeUndefined();
        expect(iv.result).toEqual(whole[i].result);
        expect(iv.result!.minima).toHaveLength(s.result.minima.length);
        continue;
      }
      expect(iv.brief).toBe(true);
      expect(iv.counts).toEqual({ minima: 8, starts: 256, unconverged: 0 });
      const m = whole[i].result!.minima[0];
      expect(m.misfit).toBe(s.result.minima[0].misfit);
      expect(iv.result!.minima).toHaveLength(1);
      expect(iv.result!.minima[0]).toMatchObject({
        misfit: m.misfit,
        reducedChi2: m.reducedChi2,
        count: m.count,
        sources: m.sources,
        stdErrors: m.stdErrors,
      });
    }
  });

  it('is a small fraction of the whole run', async () => {
    const full = Buffer.byteLength(JSON.stringify(await getRunView(world.networkId, runId)));
    const summary = Buffer.byteLength(JSON.stringify(await getRunSummary(world.networkId, runId)));
    expect(summary).toBeLessThan(full / 10);
  });

  it('gives any interval whole on demand, and 404 for a time the run has not', async () => {
    const iv = await getIntervalView(world.networkId, runId, stored[3].startsAt);
    expect(iv.result).toEqual((await getRunView(world.networkId, runId)).intervals[3].result);
    expect(iv.result!.minima.map((m) => m.misfit)).toEqual((stored[3].result as InversionResult).minima.map((m) => m.misfit));
    await expect(getIntervalView(world.networkId, runId, new Date(Date.UTC(2031, 0, 1)))).rejects.toMatchObject({ status: 404 });
  });
});

describe('run API', () => {
  const member = async () => {
    const u = await makeUser('Reader', `sum${Math.random().toString(36).slice(2, 6)}`);
    await upsertMembership(world.networkId, u.userId, 'viewer');
    return u;
  };
  const params = () => ({ networkId: world.networkId, runId });

  it('sends the summary by default, one interval with ?interval=, everything with ?detail=full', async () => {
    const u = await member();
    const base = `/api/networks/${world.networkId}/runs/${runId}`;
    const summary = await (await call(runRoute.GET, u, { path: base, params: params() })).json();
    expect(summary.intervals.filter((i: { brief?: true }) => i.brief)).toHaveLength(INTERVALS - 2);
    const at = stored[5].startsAt.toISOString();
    const one = await call(runRoute.GET, u, { path: `${base}?interval=${encodeURIComponent(at)}`, params: params() });
    expect(one.status).toBe(200);
    const full = await (await call(runRoute.GET, u, { path: `${base}?detail=full`, params: params() })).json();
    expect((await one.json()).interval.result).toEqual(full.intervals[5].result);
    expect(full.intervals.some((i: { brief?: true }) => i.brief)).toBe(false);
  });

  it('refuses a malformed interval time with 400 naming the field', async () => {
    const u = await member();
    const res = await call(runRoute.GET, u, {
      path: `/api/networks/${world.networkId}/runs/${runId}?interval=2026-13-45T00:00:00Z`,
      params: params(),
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).field).toBe('interval');
  });
});
