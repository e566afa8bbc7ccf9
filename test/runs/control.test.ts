/**
 * What a run may do next, through the functions the routes call: a queued run that is
 * cancelled ends at once (no worker will claim it), a running one is only asked to stop, an
 * ended run cannot be cancelled, only a failed or cancelled run goes back to the queue (with
 * a job for it), and a run is deleted only once it has ended.
 */
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { getBoss } from '@/db/jobs';
import { claimRun, endRun, getRunById } from '@/db/repo/runs';
import { cancelRun, removeRun, rerunRun } from '@/src/runs/control';
import { PHASE, hasEnded, mayCancel, mayDelete, mayRerun } from '@/src/runs/lifecycle';
import { RUN_QUEUE } from '@/src/runs/queues';
import { AppError } from '@/src/server/errors';
import { makeRunWorld, newRun } from './world';

const status = (e: unknown) => (e instanceof AppError ? e.status : e);

describe('run lifecycle rules', () => {
  it('lets a run be cancelled until it ends, re-run once failed or cancelled, deleted once ended', () => {
    expect(['queued', 'running'].map((s) => mayCancel(s as never))).toEqual([true, true]);
    expect(['finished', 'failed', 'cancelled'].map((s) => hasEnded(s as never))).toEqual([true, true, true]);
    expect(['queued', 'running', 'finished', 'failed', 'cancelled'].map((s) => mayRerun(s as never))).toEqual([
      false,
      false,
      false,
      true,
      true,
    ]);
    expect(['queued', 'running', 'finished'].map((s) => mayDelete(s as never))).toEqual([false, false, true]);
  });
});

describe('cancelling, re-running and deleting runs', () => {
  beforeEach(resetDatabase);
  afterAll(() => closeQueueAndDatabase());

  it('ends a queued run at once, and no worker claims it afterwards', async () => {
    const w = await makeRunWorld(1);
    const run = await newRun(w);
    const row = await cancelRun(w.networkId, run.id, null);
    expect(row.state).toBe('cancelled');
    expect(row.progress.phase).toBe(PHASE.cancelledBeforeStart);
    expect(await claimRun(run.id, 'w1')).toBeNull();
  });

  it('only asks a running run to stop, and refuses to cancel or delete while it is live', async () => {
    const w = await makeRunWorld(1);
    const run = await newRun(w);
    expect(await claimRun(run.id, 'w1')).not.toBeNull();
    await expect(removeRun(w.networkId, run.id, null).catch(status)).resolves.toBe(409);
    const row = await cancelRun(w.networkId, run.id, null);
    expect(row.state).toBe('running');
    expect(row.cancelRequested).toBe(true);
    expect(await endRun(run.id, 'cancelled', null, null, 'w1')).toBe(true);
    await expect(cancelRun(w.networkId, run.id, null).catch(status)).resolves.toBe(409);
  });

  it('puts a cancelled run back in the queue with a job, but not a finished one; deletes an ended run', async () => {
    const w = await makeRunWorld(1);
    const run = await newRun(w);
    await cancelRun(w.networkId, run.id, null);
    const boss = await getBoss();
    await boss.purgeQueue(RUN_QUEUE);
    const again = await rerunRun(w.networkId, run.id, null);
    expect(again.state).toBe('queued');
    expect(again.cancelRequested).toBe(false);
    expect(again.progress.phase).toBe(PHASE.waiting);
    expect(await boss.getQueueSize(RUN_QUEUE)).toBe(1);

    await endRun(run.id, 'finished', null);
    await expect(rerunRun(w.networkId, run.id, null).catch(status)).resolves.toBe(409);
    await removeRun(w.networkId, run.id, null);
    expect(await getRunById(run.id)).toBeNull();
  });
});
