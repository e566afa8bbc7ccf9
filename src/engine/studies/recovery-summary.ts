/**
 * How well the free parameters came back over a recovery study's
 * realisations: per parameter the mean and spread of the estimates, the pulls
 * (estimate - truth) / stdError with their mean and spread, and the coverage
 * of the stated errors, the share of realisations whose +-1 and +-1.96
 * stdError intervals hold the truth (68 % and 95 % for Gaussian errors;
 * common practice). Longitudes differ by the shorter way round. Realisations
 * whose best minimum is singular state no usable error: they are counted, and
 * left out of the pulls, coverage and mean correlation.
 */
import { wrapLon } from '@/src/engine/geometry/great-circle';
import { physicalParams, type Parameterisation } from '@/src/engine/inverse/parameters';
import type { Minimum, NamedMatrix } from '@/src/engine/inverse/types';
import { meanAndSpread } from '@/src/engine/stats/mean-spread';
import type { RecoveredParameter } from './types';

/** Half-width, in standard errors, of the interval that holds a Gaussian truth 95 % of the time. */
const Z95 = 1.959963984540054;

export function recoveredParameters(par: Parameterisation, truth: Float64Array, best: readonly Minimum[]): RecoveredParameter[] {
  const physical = physicalParams(par, truth);
  return par.slots.map((s) => {
    const t = physical[s.name];
    const region = par.regions[s.region].name;
    const diff = (m: Minimum) => (s.kind === 'lon' ? wrapLon(m.params[s.name] - t) : m.params[s.name] - t);
    const all = meanAndSpread(best.map(diff));
    const trusted = best.filter((m) => !m.singular);
    const pulls = trusted.map((m) => diff(m) / m.stdErrors[region][s.kind]!);
    const p = meanAndSpread(pulls);
    const share = (z: number) => (pulls.length ? pulls.filter((x) => Math.abs(x) <= z).length / pulls.length : NaN);
    return {
      name: s.name,
      truth: t,
      mean: s.kind === 'lon' ? wrapLon(t + all.mean) : t + all.mean,
      spread: all.spread,
      pullMean: p.mean,
      pullSpread: p.spread,
      coverage68: share(1),
      coverage95: share(Z95),
    };
  });
}

/** The mean correlation matrix of the non-singular realisations' best minima. */
export function meanCorrelation(names: string[], best: readonly Minimum[]): NamedMatrix {
  const trusted = best.filter((m) => !m.singular);
  const n = names.length;
  const matrix = Array.from({ length: n }, (_, a) =>
    Array.from({ length: n }, (_, b) =>
      trusted.length ? trusted.reduce((acc, m) => acc + m.correlation.matrix[a][b], 0) / trusted.length : a === b ? 1 : 0,
    ),
  );
  return { names, matrix };
}
