/**
 * The time-estimate model on synthetic timings with a known truth: intervals
 * timed as start-up + units x cost (plus a few slowed by other work) give back
 * the cost and the start-up; a run of one interval alone still gives a cost.
 */
import { describe, expect, it } from 'vitest';
import { estimateRunSeconds, measureSpeed, type TimedInterval } from '@/src/runs/time-estimate';

const COST = 2e-5;
const STARTUP = 1.5;

function run(runId: string, intervals: number, nData: number, starts: number, slow: number[] = []): TimedInterval[] {
  return Array.from({ length: intervals }, (_, i) => {
    const units = nData * 5 * starts;
    return {
      runId,
      startsAt: new Date(Date.UTC(2031, 0, 1, 0, 10 * i)),
      nData,
      nParams: 5,
      starts,
      seconds: (i === 0 ? STARTUP : 0) + units * COST * (slow.includes(i) ? 3 : 1),
    };
  });
}

describe('measured engine speed', () => {
  it('recovers the per-unit cost and the start-up, unmoved by a few slowed intervals', () => {
    const speed = measureSpeed([...run('a', 13, 779, 4, [5, 9]), ...run('b', 7, 969, 6, [2])])!;
    expect(speed.secondsPerUnit).toBeCloseTo(COST, 10);
    expect(speed.startupSeconds).toBeCloseTo(STARTUP, 9);
    expect(speed.intervals).toBe(20);
    // A new run of 10 intervals of 1000 x 5 x 3 units, exactly as the model times it.
    expect(estimateRunSeconds(speed, 10, 1000 * 5 * 3)).toBeCloseTo(STARTUP + 10 * 15000 * COST, 9);
  });

  it('uses a lone interval for the cost, with no start-up, and nothing without rows', () => {
    const lone = run('c', 1, 100, 2).map((r) => ({ ...r, seconds: 100 * 5 * 2 * COST }));
    expect(measureSpeed(lone)).toEqual({ secondsPerUnit: COST, startupSeconds: 0, intervals: 1 });
    expect(measureSpeed([])).toBeNull();
    expect(measureSpeed(lone.map((r) => ({ ...r, seconds: 0 })))).toBeNull();
    expect(estimateRunSeconds({ secondsPerUnit: COST, startupSeconds: STARTUP }, 0, 1000)).toBe(0);
  });
});
