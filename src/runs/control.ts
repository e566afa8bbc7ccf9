/** A network's runs: listing, cancelling, re-running and deleting (the pages and route handlers call these). */
import { deleteRun, endRun, getRun, requestCancel, requeueRun, type RunRow } from '@/db/repo/runs';
import { conflict, notFound } from '@/src/server/errors';
import { enqueueRunWork } from './queues';
import { settleCancelledRun } from '@/db/repo/run-chunks';
import { settings } from '@/src/settings';
import { mayCancel, mayDelete, mayRerun, PHASE, RERUNNABLE_STATES } from './lifecycle';
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
  // here and now, as does a running one none of whose chunks is in a worker's hands; otherwise
  // each worker on it stops at its next check, and the last one ends the run.
  if (row.state === 'queued' && (await endRun(runId, 'cancelled', { ...row.progress, phase: PHASE.cancelledBeforeStart })))
    return (await getRun(networkId, runId)) ?? row;
  if (row.state === 'running' && (await settleCancelledRun(runId, settings().CAVITAS_RUN_LEASE_S, PHASE.cancelledAfter)))
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

export async function removeRun(networkId: string, runId: string, actorId: string | null): Promise<void> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (!mayDelete(run.state)) throw conflict('Cancel the run before deleting it.');
  await deleteRun(networkId, runId);
  await recordRun(networkId, actorId, 'deleted', run, `run "${run.name}"`);
}
