/**
 * Misfit surfaces: chi-square on a grid over two free parameters, the others
 * either held at a minimum ('fixed') or re-optimised at every grid point
 * ('profile', each point started from the minimum). Grid values are physical
 * (intensity in C^2 km^2/s, degrees). Any least-squares problem over the
 * region parameterisation will do: log-power spectra or mode parameters.
 */
import { levenbergMarquardt } from '@/src/engine/optim/levenberg-marquardt';
import { sumSquares } from '@/src/engine/optim/normal-equations';
import { holdParameters } from '@/src/engine/optim/subproblem';
import type { LeastSquaresProblem, LmOptions } from '@/src/engine/optim/types';
import { InversionInputError } from './errors';
import type { Parameterisation } from './parameters';
import type { MisfitSurface } from './types';

export interface SurfaceRequest {
  xName: string;
  yName: string;
  x: number[];
  y: number[];
  mode: 'fixed' | 'profile';
  /** Internal free vector of the minimum the surface is drawn around. */
  at: number[];
  lm?: Partial<LmOptions>;
}

function toInternal(par: Parameterisation, j: number, v: number): number {
  const kind = par.slots[j].kind;
  if (kind === 'intensity') {
    if (!(v > 0)) throw new InversionInputError(`${par.slots[j].name}: grid values must be above 0, got ${v}`);
    return Math.log(v);
  }
  if (kind === 'lon') {
    // bring the longitude into the unwrapped range of the parameter
    const lo = par.slots[j].lower;
    return lo + ((((v - lo) % 360) + 360) % 360);
  }
  return v;
}

export function misfitSurface(
  problem: LeastSquaresProblem,
  par: Parameterisation,
  req: SurfaceRequest,
  shouldCancel?: () => boolean,
): MisfitSurface {
  const ix = par.names.indexOf(req.xName);
  const iy = par.names.indexOf(req.yName);
  if (ix < 0) throw new InversionInputError(`surface: "${req.xName}" is not a free parameter (free: ${par.names.join(', ')})`);
  if (iy < 0) throw new InversionInputError(`surface: "${req.yName}" is not a free parameter (free: ${par.names.join(', ')})`);
  if (ix === iy) throw new InversionInputError('surface: the two parameters must differ');
  if (req.at.length !== par.names.length)
    throw new InversionInputError(`surface: the minimum has ${req.at.length} values, expected ${par.names.length}`);
  if (req.x.length === 0 || req.y.length === 0) throw new InversionInputError('surface: empty grid');
  const r = new Float64Array(problem.nResiduals);
  const p = Float64Array.from(req.at);
  const misfit = req.y.map((yv) =>
    req.x.map((xv) => {
      if (shouldCancel?.()) return NaN;
      const xi = toInternal(par, ix, xv);
      const yi = toInternal(par, iy, yv);
      if (req.mode === 'fixed' || par.names.length === 2) {
        p.set(req.at);
        p[ix] = xi;
        p[iy] = yi;
        problem.residuals(p, r);
        return sumSquares(r);
      }
      const sub = holdParameters(
        problem,
        new Map([
          [ix, xi],
          [iy, yi],
        ]),
      );
      return levenbergMarquardt(sub, sub.reduce(req.at), req.lm ?? {}).chi2;
    }),
  );
  return { xName: req.xName, yName: req.yName, x: req.x, y: req.y, misfit, mode: req.mode };
}
