/**
 * Quality flags of a mode fit: 'fit-failed' when the optimiser did not reach a
 * minimum or the covariance is singular; 'implausible-modes' when a mode sits
 * on the edge of its search window or of the allowed half-widths, has a Q-factor outside the usual range or
 * an amplitude no better determined than its own size.
 */
import {
  MODE_AMPLITUDE_REL_ERROR_MAX,
  MODE_HALF_WIDTH_MAX_HZ,
  MODE_HALF_WIDTH_MIN_HZ,
  MODE_Q_MAX,
  MODE_Q_MIN,
} from '@/src/engine/tolerances';
import type { FitFlag, ModeFit } from './types';

export function qualityOfFit(fit: ModeFit, extra: { singular: boolean; lower: Float64Array; upper: Float64Array }): FitFlag[] {
  const flags: FitFlag[] = [];
  const finite = fit.modes.every(
    (m) => Number.isFinite(m.frequency) && Number.isFinite(m.amplitude) && Number.isFinite(m.halfWidth),
  );
  if (!fit.converged || extra.singular || !finite) flags.push('fit-failed');
  const lo = [...extra.lower].filter((_, j) => j % 3 === 0 && j < 3 * fit.modes.length).sort((a, b) => a - b);
  const hi = [...extra.upper].filter((_, j) => j % 3 === 0 && j < 3 * fit.modes.length).sort((a, b) => a - b);
  const implausible = fit.modes.some((m, n) => {
    const onEdge =
      Math.abs(m.frequency - lo[n]) < 1e-6 ||
      Math.abs(m.frequency - hi[n]) < 1e-6 ||
      Math.abs(m.halfWidth - MODE_HALF_WIDTH_MIN_HZ) < 1e-6 ||
      Math.abs(m.halfWidth - MODE_HALF_WIDTH_MAX_HZ) < 1e-6;
    const badQ = !(m.q >= MODE_Q_MIN && m.q <= MODE_Q_MAX);
    const weak = !(m.amplitude > 0) || !(m.errors.amplitude <= MODE_AMPLITUDE_REL_ERROR_MAX * m.amplitude);
    return onEdge || badQ || weak;
  });
  if (implausible) flags.push('implausible-modes');
  return flags;
}
