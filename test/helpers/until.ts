/** Polling helpers of the tests that watch other processes work (worker crash, restart under the supervisor). */
import { getRunById } from '@/db/repo/runs';

/** Polls `probe` every `everyMs` until it gives a value; after `timeoutMs` fails naming `what`, with the end of `log()`. */
export async function until<T>(
  what: string,
  probe: () => Promise<T | null | undefined | false>,
  timeoutMs: number,
  log: () => string,
  everyMs = 200,
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline)
      throw new Error(`${what}: not reached within ${timeoutMs / 1000} s\n--- output ---\n${log().slice(-3000)}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/** A probe for `until`: the run once it has ended (finished, failed or cancelled). */
export const runEnded = (runId: string) => async () => {
  const r = await getRunById(runId);
  return r && ['finished', 'failed', 'cancelled'].includes(r.state) ? r : null;
};
