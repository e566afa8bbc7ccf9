/** The errors a run shows: stated, legacy scaled ones divided back, and scaled by the misfit only on request. */
import { describe, expect, it } from 'vitest';
import { errorScaleLabel, shownErrors, type ShownMinimum } from '@/src/runs/error-scaling';
import { scalesErrorsByMisfit } from '@/src/runs/config';
import type { InversionResult } from '@/src/engine/inverse/types';

const result = (reducedChi2: number, errorBasis?: 'stated') =>
  ({
    minima: [{ reducedChi2, misfit: reducedChi2 * 10, stdErrors: { North: { intensity: 6, lat: 0.3 } } }],
    ...(errorBasis ? { errorBasis } : {}),
  }) as unknown as InversionResult;
const first = (r: InversionResult) => r.minima[0] as ShownMinimum;

describe('shown errors', () => {
  it('keeps stated errors when the run does not scale', () => {
    const m = first(shownErrors(result(4, 'stated'), false, false));
    expect(m.stdErrors.North).toEqual({ intensity: 6, lat: 0.3 });
    expect(m.errorScale).toBe(1);
    expect(errorScaleLabel(m.errorScale)).toBe('as stated');
  });

  it('scales by sqrt(chi2/dof) above 1 only, and says so', () => {
    const up = first(shownErrors(result(4, 'stated'), true, false));
    expect(up.stdErrors.North.intensity).toBeCloseTo(12, 12);
    expect(up.stdErrors.North.lat).toBeCloseTo(0.6, 12);
    expect(up.errorScale).toBe(2);
    expect(errorScaleLabel(up.errorScale)).toBe('scaled ×2.00 by the misfit');
    const below = first(shownErrors(result(0.25, 'stated'), true, false));
    expect(below.stdErrors.North.intensity).toBe(6);
  });

  it('divides legacy errors (covariance times the reduced chi2) back to the stated ones', () => {
    // Stored errors were sigma * sqrt(0.25): the stated ones are twice as large.
    const legacy = first(shownErrors(result(0.25), false, true));
    expect(legacy.stdErrors.North.intensity).toBeCloseTo(12, 12);
    // Under the switch a legacy run with chi2/dof 4 shows stored (already x2) errors, x2 / 2 back, x2 again.
    const both = first(shownErrors(result(4), true, true));
    expect(both.stdErrors.North.intensity).toBeCloseTo(6, 12);
    expect(both.errorScale).toBe(2);
    // Intervals solved after the change carry the marker and are not divided.
    expect(first(shownErrors(result(4, 'stated'), false, true)).stdErrors.North.intensity).toBe(6);
  });

  it('takes the switch from the run, falling back to the old covariance setting, off by default', () => {
    const damping = { initialLambda: 0.01, maxIterations: 10 };
    expect(scalesErrorsByMisfit({ damping })).toBe(false);
    expect(scalesErrorsByMisfit({ damping: { ...damping, scaleCovariance: true } })).toBe(true);
    expect(scalesErrorsByMisfit({ damping: { ...damping, scaleCovariance: true }, scaleErrorsByMisfit: false })).toBe(false);
  });
});
