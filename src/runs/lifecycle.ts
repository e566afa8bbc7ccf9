/**
 * What a run may do next. A run is queued, then running (its chunks claimed by workers, each
 * chunk handed back to the queue when its worker stops), and ends finished, failed or cancelled; a failed or
 * cancelled run may be put back in the queue, keeping its finished intervals. A queued or running
 * run may be paused: no worker takes up its chunks, and each chunk at work stops after the
 * interval in hand; resuming puts it back in the queue with the chunks not done. These rules are
 * declared here once; the queries in db/repo/runs.ts apply them, the pages show them.
 */
import type { RunState } from '@/db/repo/runs';

/** States after which nothing more is written to a run (its intervals, progress or heartbeat). */
export const ENDED_STATES = ['finished', 'failed', 'cancelled'] as const satisfies readonly RunState[];

/** States from which a run may be put back in the queue. */
export const RERUNNABLE_STATES = ['failed', 'cancelled'] as const satisfies readonly RunState[];

/** States from which a run may be paused (only a run worked in chunks). */
export const PAUSABLE_STATES = ['queued', 'running'] as const satisfies readonly RunState[];

/** The phase a run shows when a state change, not its worker, wrote its progress. */
export const PHASE = {
  waiting: 'waiting for a worker',
  paused: 'paused (each chunk at work stops after the interval in hand)',
  cancelledBeforeStart: 'cancelled before it started',
  cancelledWorkerGone: 'cancelled (its worker had stopped)',
  cancelledAfter: (kept: number, total: number) => `cancelled after ${kept} of ${total} intervals`,
} as const;

export const hasEnded = (s: RunState): boolean => (ENDED_STATES as readonly RunState[]).includes(s);
/** Only a run that has not ended can be asked to stop; a queued one stops at once. */
export const mayCancel = (s: RunState): boolean => !hasEnded(s);
export const mayRerun = (s: RunState): boolean => (RERUNNABLE_STATES as readonly RunState[]).includes(s);
export const mayPause = (s: RunState): boolean => (PAUSABLE_STATES as readonly RunState[]).includes(s);
export const mayResume = (s: RunState): boolean => s === 'paused';
/** A run is deleted only once it has ended (cancel it first). */
export const mayDelete = (s: RunState): boolean => hasEnded(s);
