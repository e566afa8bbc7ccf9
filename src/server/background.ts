/**
 * Work that must not hold up an answer — mail sent on request, so that the answer takes as long
 * whether or not an account exists. It runs in this server process after the caller has its
 * answer; a failure is logged, never thrown. Tests await `backgroundIdle()`.
 */
const pending = new Set<Promise<void>>();

export function runInBackground(what: string, work: () => Promise<void>): void {
  const p: Promise<void> = Promise.resolve()
    .then(work)
    .catch((e) => console.error(`[cavitas] ${what} failed`, e))
    .finally(() => pending.delete(p));
  pending.add(p);
}

/** Resolves once every piece of background work started so far (and any it started) is done. */
export async function backgroundIdle(): Promise<void> {
  while (pending.size > 0) await Promise.all([...pending]);
}
