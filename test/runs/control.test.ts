/**
 * What a run may do next, through the functions the routes call: a queued run that is
 * cancelled ends at once (no worker will claim it), a running one is only asked to stop, an
 * ended run cannot be cancelled, only a failed or cancelled run goes back to the queue (with
 * a job for it), a run is deleted only once it has ended, and only a queued or running run is
 * paused (a paused one is resumed with its jobs, or cancelled at once).
 */
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { getBoss } from '@/db/jobs';
import { claimRun, endRun, getRunById } from '@/db/repo/runs';
import { cancelRun, removeRun, rerunRun, setRunPaused } from '@/src/runs/control';
import { PHASE, hasEnded, mayCancel, mayDelete, mayPause, mayRerun, mayResume } from '@/src/runs/lifecycle';
import { RUN_QUEUE } from '@/src/runs/queues';
import { launchRun } from '@/src/runs/launch';
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

  it('lets a queued or running run be paused, and only a paused one resumed; a paused run has not ended', () => {
    const all = ['queued', 'running', 'paused', 'finished', 'failed', 'cancelled'] as never[];
    expect(all.map(mayPause)).toEqual([true, true, false, false, false, false]);
    expect(all.map(mayResume)).toEqual([false, false, true, false, false, false]);
    expect([hasEnded('paused'), mayCancel('paused'), mayDelete('paused'), mayRerun('paused')]).toEqual([
      false,
      true,
      false,
      false,
    ]);
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
  it('pauses a queued run (no worker claims it), resumes it with its jobs, and cancels a paused run at once', async () => {
    const w = await makeRunWorld(2);
    const run = await launchRun(w.networkId, w.userId, w.config); // cut into chunks, as runs are now
    const boss = await getBoss();
    await boss.purgeQueue(RUN_QUEUE);
    const row = await setRunPaused(w.networkId, run.id, true, null);
    expect(row.state).toBe('paused');
    expect(row.progress.phase).toBe(PHASE.paused);
    expect(await claimRun(run.id, 'w1')).toBeNull();
    await expect(setRunPaused(w.networkId, run.id, true, null)).rejects.toThrow(
      'Only a queued or running run can be paused; this one is paused.',
    );
    const again = await setRunPaused(w.networkId, run.id, false, null);
    expect(again.state).toBe('queued');
    expect(again.progress.phase).toBe(PHASE.waiting);
    expect(await boss.getQueueSize(RUN_QUEUE)).toBeGreaterThan(0);
    await setRunPaused(w.networkId, run.id, true, null);
    expect((await cancelRun(w.networkId, run.id, null)).state).toBe('cancelled');
  });

  it('refuses to pause a finished run, or to resume one that is not paused, saying why', async () => {
    const w = await makeRunWorld(1);
    const run = await newRun(w);
    await endRun(run.id, 'finished', null);
    const refused = await setRunPaused(w.networkId, run.id, true, null).catch((e: unknown) => e);
    expect(status(refused)).toBe(409);
    expect((refused as Error).message).toBe('Only a queued or running run can be paused; this one is finished.');
    await expect(setRunPaused(w.networkId, run.id, false, null)).rejects.toThrow(
      'Only a paused run can be resumed; this one is finished.',
    );
    expect((await getRunById(run.id))!.state).toBe('finished');
  });
});
