/** The run-inversion job: finishes a queued run, and fails (so pg-boss retries later) while another worker's heartbeat holds the run. */
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { claimRun, createRun, getRunById, listRunIntervals } from '@/db/repo/runs';
import { checkLaunch } from '@/src/runs/launch';
import { job } from '@/src/worker/jobs/run-inversion';
import type { Job } from '@/db/jobs';
import { makeRunWorld } from './world';

process.env.CAVITAS_RUN_THREADS = '1';

async function queuedRun() {
  const w = await makeRunWorld(2);
  const { preview } = await checkLaunch(w.networkId, w.config);
  return createRun({
    networkId: w.networkId,
    name: 'job',
    config: w.config as never,
    modelId: w.model.id,
    gridId: w.grid.id,
    engineVersion: 'test',
    intervalStarts: preview!.intervalStarts,
    startsPerInterval: w.config.starts,
    createdBy: null,
  });
}
const jobFor = (runId: string) =>
  [{ id: `job-${runId.slice(0, 8)}`, name: 'run-inversion', data: { runId } }] as unknown as Job<{ runId: string }>[];

describe('run-inversion job', () => {
  beforeEach(resetDatabase);
  afterAll(closeDatabase);

  it('finishes a queued run', async () => {
    const run = await queuedRun();
    await expect(job.handler(jobFor(run.id))).resolves.toEqual(['finished']);
    expect((await getRunById(run.id))!.state).toBe('finished');
    expect(await listRunIntervals(run.id)).toHaveLength(2);
  });

  it('fails while another worker holds the run, leaving the run to that worker', async () => {
    const run = await queuedRun();
    expect(await claimRun(run.id, 'other-worker')).not.toBeNull();
    await expect(job.handler(jobFor(run.id))).rejects.toThrow(/held by another worker/);
    const r = await getRunById(run.id);
    expect(r!.state).toBe('running');
    expect(r!.workerId).toBe('other-worker');
    expect(await listRunIntervals(run.id)).toHaveLength(0);
  });
});
