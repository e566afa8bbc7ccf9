/**
 * Standard errors of the free parameters, from the internal vector's to the
 * physical units reported per region and quantity. Intensity is searched as
 * ln I, so sigma_I = I sigma_lnI (the delta method, first order; common
 * practice); centres and spreads are in degrees either way.
 */
import type { Parameterisation } from './parameters';
import type { ParamKind } from './types';

export function namedStdErrors(
  par: Parameterisation,
  physical: Record<string, number>,
  internal: ArrayLike<number>,
): Record<string, Partial<Record<ParamKind, number>>> {
  const out: Record<string, Partial<Record<ParamKind, number>>> = {};
  par.slots.forEach((s, j) => {
    const e = internal[j];
    (out[par.regions[s.region].name] ??= {})[s.kind] = s.kind === 'intensity' ? physical[s.name] * e : e;
  });
  return out;
}
