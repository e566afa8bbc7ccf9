/**
 * How long a run will take, from the engine's measured speed on this server.
 *
 * A run's time is modelled as a start-up (the first interval of a run also pays for
 * warming the engine and its threads) plus, per interval, a cost proportional to
 * data x free parameters x starts (each start's Levenberg–Marquardt steps build a
 * Jacobian of that size). Both are medians over recently finished intervals, so a
 * few intervals slowed by other work on the machine do not move them. Pure: the
 * rows come from the database, the answer goes to the launch preview.
 */

/** One finished interval of a run, as timed by the worker. */
export interface TimedInterval {
  runId: string;
  startsAt: Date;
  seconds: number;
  nData: number;
  nParams: number;
  starts: number;
}

export interface MeasuredSpeed {
  /** Seconds per (datum x free parameter x start) once the engine is warm. */
  secondsPerUnit: number;
  /** Extra seconds of a run's first interval. */
  startupSeconds: number;
  /** How many finished intervals the figures rest on. */
  intervals: number;
}

const units = (r: TimedInterval) => r.nData * Math.max(1, r.nParams) * Math.max(1, r.starts);

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** The measured speed from finished intervals, or null when none is usable. */
export function measureSpeed(rows: readonly TimedInterval[]): MeasuredSpeed | null {
  const usable = rows.filter((r) => r.seconds > 0 && units(r) > 0 && Number.isFinite(r.seconds));
  if (!usable.length) return null;
  const byRun = new Map<string, TimedInterval[]>();
  for (const r of usable) byRun.set(r.runId, [...(byRun.get(r.runId) ?? []), r]);
  const firsts = new Set<TimedInterval>();
  for (const list of byRun.values()) if (list.length > 1) firsts.add(list.reduce((a, b) => (b.startsAt < a.startsAt ? b : a)));
  // Warm intervals give the steady cost; a run of a single interval is all there is otherwise.
  const warm = usable.filter((r) => !firsts.has(r));
  const secondsPerUnit = median((warm.length ? warm : usable).map((r) => r.seconds / units(r)));
  const extra = [...firsts].map((r) => Math.max(0, r.seconds - units(r) * secondsPerUnit));
  return { secondsPerUnit, startupSeconds: extra.length ? median(extra) : 0, intervals: usable.length };
}

/** Estimated seconds of a run of `intervals` intervals of `unitsPerInterval` units each. */
export function estimateRunSeconds(
  speed: Pick<MeasuredSpeed, 'secondsPerUnit' | 'startupSeconds'>,
  intervals: number,
  unitsPerInterval: number,
) {
  return intervals > 0 ? speed.startupSeconds + intervals * unitsPerInterval * speed.secondsPerUnit : 0;
}
