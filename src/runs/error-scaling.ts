/**
 * The standard errors a run shows. The solver stores errors from the stated
 * sigmas alone (`errorBasis: 'stated'`). Runs solved before that stored them
 * multiplied by sqrt(reduced chi2) when their (old) covariance switch was on,
 * also where that shrank them; those are divided back first, exactly (the
 * covariance was scaled by the minimum's own reduced chi2). Then, when the run
 * asks for it, errors are scaled by the misfit (src/runs/goodness.ts
 * misfitErrorScale) and every minimum says by how much (`errorScale`), so no
 * reader can take scaled errors for stated ones.
 */
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';
import { misfitErrorScale } from './goodness';

/** A minimum as the run view shows it: `errorScale` is the factor its stdErrors carry (1: as stated). */
export type ShownMinimum = Minimum & { errorScale: number };

type StoredResult = InversionResult & { errorBasis?: 'stated' };

function scaled(m: Minimum, factor: number): Minimum['stdErrors'] {
  if (factor === 1) return m.stdErrors;
  return Object.fromEntries(
    Object.entries(m.stdErrors).map(([region, e]) => [
      region,
      Object.fromEntries(Object.entries(e).map(([k, v]) => [k, v === undefined ? v : v * factor])),
    ]),
  );
}

/**
 * The result with each minimum's errors as the run shows them. `legacyScaled`: the run was solved
 * before errors were stored as stated, with the old covariance switch on.
 */
export function shownErrors(result: StoredResult, scaleByMisfit: boolean, legacyScaled: boolean): InversionResult {
  const undo = legacyScaled && result.errorBasis !== 'stated';
  return {
    ...result,
    minima: result.minima.map((m): ShownMinimum => {
      const back = undo && m.reducedChi2 > 0 && Number.isFinite(m.reducedChi2) ? 1 / Math.sqrt(m.reducedChi2) : 1;
      const factor = misfitErrorScale(m.reducedChi2, scaleByMisfit);
      return { ...m, stdErrors: scaled(m, back * factor), errorScale: factor };
    }),
  };
}

/** How a reader should label shown errors. */
export function errorScaleLabel(factor: number | undefined): string {
  return factor !== undefined && factor !== 1 ? `scaled ×${factor.toPrecision(3)} by the misfit` : 'as stated';
}
