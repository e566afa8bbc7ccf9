/**
 * Station siting over the whole globe: every centre of a grid of `stepDeg`
 * cells is tried as a candidate station (siting.ts) with the chosen
 * components and noise, and rated by how much it would shrink the
 * uncertainty — the ratio of one parameter's standard error with the
 * candidate to without it, or, for the `volume` measure, the ratio per axis of
 * the uncertainty region's volume, (det F / det F_c)^(1/2n) (the D-optimal
 * criterion of experimental design; common practice). Below 1 is better.
 * Sites on a station or a source are left out. No inversion is run.
 */
import type { Component } from '@/src/engine/components';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { choleskyFactor } from '@/src/engine/optim/cholesky';
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { baselineInformation, informationWithSite, siteProblem } from './siting';
import { prepareStudy } from './study-problem';
import type { StudyInput } from './types';

export const VOLUME_MEASURE = 'volume';

export interface SiteGridOptions {
  /** Cell size of the candidate grid, degrees (default 10). */
  stepDeg: number;
  components: readonly Component[];
  /** Sigma of ln power of a candidate (default: the study's noise). */
  sigmaLog?: number;
  /** A free parameter's name (e.g. "R1.lat") or "volume" (default). */
  measure: string;
}

export interface SiteGrid {
  stepDeg: number;
  measure: string;
  /** The free parameters, any of which may be the measure. */
  parameters: string[];
  sites: { lat: number; lon: number; ratio: number }[];
}

export function resolveSiteGridOptions(o: Partial<SiteGridOptions>): SiteGridOptions {
  const r = {
    stepDeg: o.stepDeg ?? 10,
    components: o.components ?? ['Ez'],
    measure: o.measure ?? VOLUME_MEASURE,
    sigmaLog: o.sigmaLog,
  };
  if (!(r.stepDeg >= 2 && r.stepDeg <= 30) || !Number.isInteger(180 / r.stepDeg))
    throw new InversionInputError(`stepDeg must divide 180 and lie within 2..30 degrees, got ${r.stepDeg}`);
  if (r.components.length === 0) throw new InversionInputError('components: a candidate records at least one component');
  if (r.sigmaLog !== undefined && !(r.sigmaLog > 0)) throw new InversionInputError(`sigmaLog must be above 0, got ${r.sigmaLog}`);
  return r;
}

function logDet(f: Float64Array, n: number): number {
  const a = Float64Array.from(f);
  if (!choleskyFactor(a, n)) return NaN;
  let s = 0;
  for (let j = 0; j < n; j++) s += 2 * Math.log(a[j * n + j]);
  return s;
}

export function siteGrid(input: StudyInput, options: Partial<SiteGridOptions>): SiteGrid {
  const o = resolveSiteGridOptions(options);
  const prepared = prepareStudy(input);
  const names = prepared.par.names;
  const n = names.length;
  const j = names.indexOf(o.measure);
  if (o.measure !== VOLUME_MEASURE && j < 0)
    throw new InversionInputError(
      `measure: "${o.measure}" is neither "${VOLUME_MEASURE}" nor a free parameter (${names.join(', ')})`,
    );
  const base = baselineInformation(input, prepared);
  const rate =
    j >= 0
      ? (
          (se0) => (f: Float64Array) =>
            covarianceFromJtJ(f, n).stdErrors[j] / se0
        )(covarianceFromJtJ(base, n).stdErrors[j])
      : (
          (ld0) => (f: Float64Array) =>
            Math.exp((ld0 - logDet(f, n)) / (2 * n))
        )(logDet(base, n));
  const sites: SiteGrid['sites'] = [];
  for (let lat = -90 + o.stepDeg / 2; lat < 90; lat += o.stepDeg)
    for (let lon = -180 + o.stepDeg / 2; lon < 180; lon += o.stepDeg) {
      if (siteProblem({ lat, lon }, input)) continue;
      const site = { lat, lon, components: o.components, ...(o.sigmaLog !== undefined ? { sigmaLog: o.sigmaLog } : {}) };
      sites.push({ lat, lon, ratio: rate(informationWithSite(input, prepared, base, site)) });
    }
  return { stepDeg: o.stepDeg, measure: o.measure, parameters: names, sites };
}
