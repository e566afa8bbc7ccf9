/**
 * A case file brought back as a run: a run's interval exported as a case,
 * imported into the network (201 `{runId}`), solved by the real driver and
 * engine, gives the same best minimum as the run it came from (misfit to
 * 1e-6 relative: the same data, unknowns, starts and seed). Bad cases are
 * refused with the case's field named and store nothing (no run, model or
 * grid); only analysts and owners may import (viewers read and export).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call, errorOf, type CallerName } from '@/test/helpers/authz';
import { stopBoss } from '@/db/jobs';
import { listRunIntervals, listRuns } from '@/db/repo/runs';
import { modelRepo } from '@/db/repo/models';
import { gridRepo } from '@/db/repo/grids';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import type { InversionResult } from '@/src/engine/inverse/types';
import * as exportRoute from '@/app/api/networks/[networkId]/runs/[runId]/export/route';
import * as importRoute from '@/app/api/networks/[networkId]/runs/import/route';
import { makeSharingWorld, type SharingWorld } from '@/test/sharing/world';

let w: SharingWorld;
let caseFile: Record<string, unknown>;

beforeAll(async () => {
  await resetDatabase();
  w = await makeSharingWorld('import');
  const res = await call(exportRoute.GET, w.callers.viewer, {
    params: { networkId: w.networkId, runId: w.runId },
    path: '/x?what=case',
  });
  expect(res.status).toBe(200);
  caseFile = (await res.json()) as Record<string, unknown>;
});
afterAll(async () => {
  await stopBoss(5000);
  await closeDatabase();
});

const importAs = (c: CallerName, body: unknown, rawBody?: string) =>
  call(importRoute.POST, w.callers[c], { method: 'POST', params: { networkId: w.networkId }, body, rawBody });
const copy = () => JSON.parse(JSON.stringify(caseFile)) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
async function stored() {
  return {
    runs: (await listRuns(w.networkId)).length,
    models: (await modelRepo.list(w.networkId)).length,
    grids: (await gridRepo.list(w.networkId)).length,
  };
}

describe('import a case file as a run', () => {
  it('analysts and owners may import; viewers, outsiders and other networks may not', async () => {
    const got: number[] = [];
    for (const c of CALLERS) got.push((await importAs(c, caseFile)).status);
    expect(got).toEqual([401, 403, 201, 201, 404]);
  });

  it('the imported run, solved, finds the exported run’s best minimum', async () => {
    const res = await importAs('analyst', caseFile);
    expect(res.status).toBe(201);
    const { runId } = (await res.json()) as { runId: string };
    expect(await executeRun(runId, { solve: makeEngineSolver(1), workerId: 'import-test' })).toBe('finished');
    const [mine] = await listRunIntervals(runId);
    const [original] = await listRunIntervals(w.runId);
    const a = (mine.result as unknown as InversionResult).minima[0];
    const b = (original.result as unknown as InversionResult).minima[0];
    expect(Math.abs(a.misfit - b.misfit) / b.misfit).toBeLessThan(1e-6);
    expect(mine.startsAt.toISOString()).toBe(original.startsAt.toISOString());
    expect(mine.nData).toBe(original.nData);
  }, 300_000);

  it('refuses bad cases with the field named and stores nothing', async () => {
    const before = await stored();
    // eslint-disable-next-line @typescript-eslint/no-explicit-any -- the cases change JSON in any shape
    const cases: [(c: Record<string, any>) => void, string][] = [
      [
        (c) => {
          // a station the network lacks, consistently named in the case
          for (const o of c.observed) if (o.station === c.stations[0].code) o.station = 'NOPE';
          c.stations[0].code = 'NOPE';
        },
        'stations.0.code',
      ],
      [(c) => (c.stations[1].components = ['Ez', 'Bns', 'Bew']), 'stations.1.components'],
      [(c) => c.observed[0].power.pop(), 'observed.0.power'],
      [(c) => (c.observed[2].station = 'ELSEWHERE'), 'observed.2.station'],
      [(c) => delete c.unknowns, 'unknowns'],
      [(c) => (c.unknowns[0].lon = { min: 100, max: 200 }), 'unknowns.0.lon'],
      [(c) => (c.starts = 0), 'starts'],
      [(c) => (c.starts = 1000), 'starts'],
      [(c) => (c.cavity.model = 'wobbly'), 'cavity.model'],
      [(c) => (c.band.stepHz = -1), 'band.stepHz'],
    ];
    for (const [mutate, field] of cases) {
      const c = copy();
      mutate(c);
      const res = await importAs('owner', c);
      expect(res.status, field).toBe(400);
      const e = await errorOf(res);
      expect(e.field, `${field}: ${e.message}`).toBe(field);
    }
    expect((await importAs('owner', undefined, '{"cavity":')).status).toBe(400);
    expect((await importAs('owner', [1, 2])).status).toBe(400);
    expect(await stored()).toEqual(before);
  });
});
