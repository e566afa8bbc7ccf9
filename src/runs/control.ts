/** A network's runs: listing, cancelling, re-running and deleting (the pages and route handlers call these). */
import { deleteRun, getRun, requestCancel, requeueRun, type RunRow } from '@/db/repo/runs';
import { enqueue } from '@/db/jobs';
import { conflict, notFound } from '@/src/server/errors';

export { listRuns, type RunListEntry } from '@/db/repo/runs';
import { RUN_JOB_OPTIONS, RUN_QUEUE } from './queues';

export async function cancelRun(networkId: string, runId: string): Promise<RunRow> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (run.state !== 'queued' && run.state !== 'running') throw conflict(`The run has already ended (${run.state}).`);
  const row = await requestCancel(networkId, runId);
  if (!row) throw notFound('That run is not in this network.');
  return row;
}

/** Puts a failed or cancelled run back in the queue; finished intervals are kept. */
export async function rerunRun(networkId: string, runId: string): Promise<RunRow> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const row = await requeueRun(networkId, runId);
  if (!row) throw conflict(`Only a failed or cancelled run can be run again; this one is ${run.state}.`);
  await enqueue(RUN_QUEUE, { runId }, RUN_JOB_OPTIONS);
  return row;
}

export async function removeRun(networkId: string, runId: string): Promise<void> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  if (run.state === 'running' || run.state === 'queued') throw conflict('Cancel the run before deleting it.');
  await deleteRun(networkId, runId);
}
