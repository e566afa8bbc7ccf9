/**
 * Station siting, linearised (no inversion run): the standard errors of the
 * unknowns at the study's sources (the solution) from the Fisher information
 * of the network over the band, and again with each candidate station added
 * with its own components and noise (fisher.ts). A log-power Jacobian does not
 * depend on the observed power, so a candidate needs no data, only its place.
 * A candidate on a station's own site, or on a source (where the kernels are
 * not trusted), is refused naming it. Rows add, so a candidate's information is
 * its own J_c^T W_c J_c added to the network's.
 */
import { greatCircle } from '@/src/engine/geometry/great-circle';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { SITING_SAME_SITE_DEG, SITING_SOURCE_CLEARANCE_DEG } from '@/src/engine/tolerances';
import { DEG } from '@/src/engine/constants';
import { errorsOfInformation, fisherInformation } from './fisher';
import { noiseSeries, prepareStudy, studySpectrumInput, type PreparedStudy } from './study-problem';
import type { SiteCandidate, SitingResult, StudyInput, StudyStation } from './types';

const distanceDeg = (a: { lat: number; lon: number }, b: { lat: number; lon: number }) =>
  greatCircle(a.lat, a.lon, b.lat, b.lon).theta / DEG;

/** What keeps a site from being rated (on a station's site, or on a source), or null. */
export function siteProblem(site: { lat: number; lon: number }, input: StudyInput): string | null {
  for (const st of input.stations)
    if (distanceDeg(site, st) < SITING_SAME_SITE_DEG) return `lies on the site of station ${st.code}`;
  for (const s of input.sources)
    if (distanceDeg(site, s) < SITING_SOURCE_CLEARANCE_DEG)
      return `lies within ${SITING_SOURCE_CLEARANCE_DEG}° of source ${s.name}, where the kernels are not trusted`;
  return null;
}

/** The information of the network as it is. */
export const baselineInformation = (input: StudyInput, prepared: PreparedStudy): Float64Array =>
  fisherInformation(studySpectrumInput(input, input.stations, prepared.series), prepared.truth);

/** The network's information `base` plus that of one more station at `site` (its own J_c^T W_c J_c). */
export function informationWithSite(
  input: StudyInput,
  prepared: PreparedStudy,
  base: Float64Array,
  site: SiteCandidate,
): Float64Array {
  const station: StudyStation = { code: 'candidate', lat: site.lat, lon: site.lon, components: site.components };
  const noise = site.sigmaLog !== undefined ? { sigmaLog: site.sigmaLog } : input.noise;
  const own = fisherInformation(
    studySpectrumInput(input, [station], noiseSeries([station], prepared.freqs, noise)),
    prepared.truth,
  );
  return own.map((v, k) => v + base[k]);
}

export function sitingStudy(input: StudyInput, candidates: readonly SiteCandidate[]): SitingResult {
  const prepared = prepareStudy(input);
  candidates.forEach((c, i) => {
    const problem = siteProblem(c, input);
    if (problem) throw new InversionInputError(`candidates[${i}] (${c.lat}, ${c.lon}): ${problem}`);
    if (c.sigmaLog !== undefined && !(c.sigmaLog > 0))
      throw new InversionInputError(`candidates[${i}].sigmaLog must be above 0, got ${c.sigmaLog}`);
  });
  const { par, truth } = prepared;
  const base = baselineInformation(input, prepared);
  return {
    baseline: { stdErrors: errorsOfInformation(par, truth, base) },
    candidates: candidates.map((c) => ({
      ...c,
      stdErrors: errorsOfInformation(par, truth, informationWithSite(input, prepared, base, c)),
    })),
  };
}
