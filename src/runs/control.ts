/** A network's runs: listing, cancelling, re-running and deleting (the pages and route handlers call these). */
import { deleteRun, endRun, getRun, pauseRunRow, requestCancel, requeueRun, type RunRow } from '@/db/repo/runs';
import { conflict, notFound } from '@/src/server/errors';
import { enqueueRunWork } from './queues';
import { hasChunks, settleCancelledRun } from '@/db/repo/run-chunks';
import { workersOnRun } from './chunks';
import { settings } from '@/src/settings';
import { mayCancel, mayDelete, mayPause, mayRerun, mayResume, PAUSABLE_STATES, PHASE, RERUNNABLE_STATES } from './lifecycle';
import { record, type AuditAction } from '@/src/audit';

export { listRuns, type RunListEntry } from '@/db/repo/runs';

function recordRun(networkId: string, actorId: string | null, action: AuditAction, run: RunRow, summary: string) {
  return record({ networkId, actorId, action, subject: 'run', subjectId: run.id, summary });
}

export async function cancelRun(networkId: string, runId: string, actorId: string | null): Promise<RunRow> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (!mayCancel(run.state)) throw conflict(`The run has already ended (${run.state}).`);
  const row = await requestCancel(networkId, runId);
  if (!row) throw notFound('That run is not in this network.');
  await recordRun(networkId, actorId, 'changed', run, `asked run "${run.name}" to stop`);
  // No worker claims a run (or a chunk of it) once it is asked to stop, so a queued run ends
  // here and now, as does a running or paused one none of whose chunks is in a worker's hands;
  // otherwise each worker on it stops at its next check, and the last one ends the run.
  if (row.state === 'queued' && (await endRun(runId, 'cancelled', { ...row.progress, phase: PHASE.cancelledBeforeStart })))
    return (await getRun(networkId, runId)) ?? row;
  if (
    (row.state === 'running' || row.state === 'paused') &&
    (await settleCancelledRun(runId, settings().CAVITAS_RUN_LEASE_S, PHASE.cancelledAfter))
  )
    return (await getRun(networkId, runId)) ?? row;
  return row;
}

/** Puts a failed or cancelled run back in the queue; finished intervals are kept. */
export async function rerunRun(networkId: string, runId: string, actorId: string | null): Promise<RunRow> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (!mayRerun(run.state)) throw conflict(`Only a failed or cancelled run can be run again; this one is ${run.state}.`);
  const row = await requeueRun(networkId, runId, RERUNNABLE_STATES, PHASE.waiting);
  if (!row) throw conflict(`Only a failed or cancelled run can be run again; this one is ${run.state}.`);
  await enqueueRunWork(runId); // what is left: the chunks not done
  await recordRun(networkId, actorId, 'changed', run, `put run "${run.name}" back in the queue`);
  return row;
}

/**
 * Pauses a queued or running run (`paused` true) or resumes a paused one (false). Pausing: no
 * worker takes up its chunks, each chunk at work stops after the interval in hand (what is
 * stored stays). Resuming: the run goes back to the queue with one job per chunk not done, once
 * every chunk has stopped.
 */
export async function setRunPaused(networkId: string, runId: string, paused: boolean, actorId: string | null): Promise<RunRow> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (paused) {
    if (!mayPause(run.state) || run.cancelRequested)
      throw conflict(`Only a queued or running run can be paused; this one is ${run.cancelRequested ? 'stopping' : run.state}.`);
    if (!(await hasChunks(runId)))
      throw conflict('This run is worked whole by one worker (it predates chunks), so it cannot be paused.');
    const row = await pauseRunRow(networkId, runId, PAUSABLE_STATES, PHASE.paused);
    if (!row) throw conflict(`Only a queued or running run can be paused; this one has changed meanwhile.`);
    await recordRun(networkId, actorId, 'changed', run, `paused run "${run.name}"`);
    return row;
  }
  if (!mayResume(run.state)) throw conflict(`Only a paused run can be resumed; this one is ${run.state}.`);
  const busy = await workersOnRun(runId);
  if (busy > 0)
    throw conflict(`The run is still pausing: ${busy} worker(s) are finishing the interval in hand. Try again shortly.`);
  const row = await requeueRun(networkId, runId, ['paused'], PHASE.waiting);
  if (!row) throw conflict('Only a paused run can be resumed; this one has changed meanwhile.');
  await enqueueRunWork(runId); // the chunks not done
  await recordRun(networkId, actorId, 'changed', run, `resumed run "${run.name}"`);
  return row;
}

export async function removeRun(networkId: string, runId: string, actorId: string | null): Promise<void> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (!mayDelete(run.state)) throw conflict('Cancel the run before deleting it.');
  await deleteRun(networkId, runId);
  await recordRun(networkId, actorId, 'deleted', run, `run "${run.name}"`);
}
