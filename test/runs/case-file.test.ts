/**
 * A run exported as a case file and solved again outside the web app: the
 * command line's `invert` (run as a user would, through npm) on the exported
 * case, with the run's starts and seed, finds the run's best minimum — misfit
 * equal to 1e-6 relative, the same sources. Series runs name the interval by
 * its start or its id. The case carries what the command line needs and
 * passes the engine's own case schema.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call, errorOf } from '@/test/helpers/authz';
import { stopBoss } from '@/db/jobs';
import { listRunIntervals } from '@/db/repo/runs';
import { invertAnyCaseSchema } from '@/src/engine/case/mode-input';
import { intervalInputFromCase } from '@/src/engine/case/interval-input';
import { getRun } from '@/db/repo/runs';
import { loadRunContext } from '@/src/runs/context';
import { loadIntervalObservations } from '@/src/runs/observations';
import { intervalInput } from '@/src/runs/interval-input';
import type { InversionResult } from '@/src/engine/inverse/types';
import * as exportRoute from '@/app/api/networks/[networkId]/runs/[runId]/export/route';
import { makeSharingWorld, type SharingWorld } from '@/test/sharing/world';
import { root } from '@/test/cli/helpers';

let w: SharingWorld;
const dir = mkdtempSync(join(tmpdir(), 'cavitas-case-export-'));

beforeAll(async () => {
  await resetDatabase();
  w = await makeSharingWorld('cases', 2);
});
afterAll(async () => {
  await stopBoss(5000);
  await closeDatabase();
});

async function exported(query: string, caller = w.callers.viewer) {
  return call(exportRoute.GET, caller, { params: { networkId: w.networkId, runId: w.runId }, path: `/x?what=case${query}` });
}

/** `npm run --silent cli -- invert case.json --starts S --seed D`, the documented command. */
function invertWithCli(body: unknown, starts: number, seed: number) {
  const f = join(dir, `case-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(f, JSON.stringify(body));
  const res = spawnSync(
    'npm',
    ['run', '--silent', 'cli', '--', 'invert', f, '--starts', String(starts), '--seed', String(seed)],
    {
      cwd: root,
      encoding: 'utf8',
      timeout: 300_000,
    },
  );
  expect(res.status, res.stderr).toBe(0);
  return JSON.parse(res.stdout) as InversionResult;
}

describe('export a run interval as a case file', () => {
  it('every member may export it; others get 401/404', async () => {
    const got: number[] = [];
    for (const c of CALLERS) got.push((await exported(`&interval=${w.intervals[0]}`, w.callers[c])).status);
    expect(got).toEqual([401, 200, 200, 200, 404]);
  });

  it('the command line reproduces the best minimum of each interval (misfit to 1e-6 relative)', async () => {
    const rows = await listRunIntervals(w.runId);
    expect(rows).toHaveLength(2);
    for (const [k, row] of rows.entries()) {
      // the first by its start time, the second by its id
      const res = await exported(`&interval=${k === 0 ? encodeURIComponent(row.startsAt.toISOString()) : row.id}`);
      expect(res.status).toBe(200);
      expect(res.headers.get('content-disposition')).toMatch(/attachment; filename=".*-case\.json"/);
      const body = (await res.json()) as Record<string, unknown>;
      const parsed = invertAnyCaseSchema.safeParse(body);
      expect(parsed.success).toBe(true);
      // Read back, it is the very problem the run's solver built for this interval.
      const ctx = await loadRunContext((await getRun(w.networkId, w.runId))!);
      const asRun = intervalInput(ctx, await loadIntervalObservations(w.networkId, ctx.config, row.startsAt));
      expect(intervalInputFromCase(parsed.data!)).toEqual(asRun);
      expect(body).toMatchObject({ starts: w.config.starts, seed: w.config.seed });
      const stored = row.result as unknown as InversionResult;
      const cli = invertWithCli(body, body.starts as number, body.seed as number);
      const best = stored.minima[0];
      const again = cli.minima[0];
      expect(Math.abs(again.misfit - best.misfit) / best.misfit).toBeLessThan(1e-6);
      expect(again.misfit).toBeGreaterThan(10); // noisy data: a real chi-square, not a zero
      for (const s of best.sources) {
        const t = again.sources.find((x) => x.name === s.name)!;
        expect(Math.abs(t.intensity - s.intensity) / s.intensity).toBeLessThan(1e-4);
        expect(Math.abs(t.lat - s.lat)).toBeLessThan(1e-4);
        expect(Math.abs(t.lon - s.lon)).toBeLessThan(1e-4);
      }
    }
  }, 600_000);

  it('a series run needs the interval named; an unknown interval is a 404', async () => {
    const none = await exported('');
    expect(none.status).toBe(400);
    expect((await errorOf(none)).field).toBe('interval');
    expect((await exported('&interval=2030-01-01T00:00:00Z')).status).toBe(404);
    expect((await exported('&interval=7d1c6a7e-0000-4000-8000-000000000000')).status).toBe(404);
  });
});
