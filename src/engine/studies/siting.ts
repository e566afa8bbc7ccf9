/**
 * Station siting, linearised (no inversion run): the standard errors of the
 * unknowns at the study's sources (the solution) from the Fisher information
 * of the network over the band, and again with each candidate station added
 * with its own components and noise (fisher.ts). A log-power Jacobian does not
 * depend on the observed power, so a candidate needs no data, only its place.
 * A candidate on a station's own site, or on a source (where the kernels are
 * not trusted), is refused naming it.
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

/** The standard errors of the network with one more station at `site` (prepared once per study). */
export function errorsWithSite(input: StudyInput, prepared: PreparedStudy, site: SiteCandidate) {
  const codes = new Set(input.stations.map((s) => s.code));
  let code = 'candidate';
  while (codes.has(code)) code += '+';
  const station: StudyStation = { code, lat: site.lat, lon: site.lon, components: site.components };
  const noise = site.sigmaLog !== undefined ? { sigmaLog: site.sigmaLog } : input.noise;
  const series = [...prepared.series, ...noiseSeries([station], prepared.freqs, noise)];
  const information = fisherInformation(studySpectrumInput(input, [...input.stations, station], series), prepared.truth);
  return errorsOfInformation(prepared.par, prepared.truth, information);
}

export function sitingStudy(input: StudyInput, candidates: readonly SiteCandidate[]): SitingResult {
  const prepared = prepareStudy(input);
  candidates.forEach((c, i) => {
    const problem = siteProblem(c, input);
    if (problem) throw new InversionInputError(`candidates[${i}] (${c.lat}, ${c.lon}): ${problem}`);
    if (c.sigmaLog !== undefined && !(c.sigmaLog > 0))
      throw new InversionInputError(`candidates[${i}].sigmaLog must be above 0, got ${c.sigmaLog}`);
  });
  const baseline = errorsOfInformation(
    prepared.par,
    prepared.truth,
    fisherInformation(studySpectrumInput(input, input.stations, prepared.series), prepared.truth),
  );
  return {
    baseline: { stdErrors: baseline },
    candidates: candidates.map((c) => ({ ...c, stdErrors: errorsWithSite(input, prepared, c) })),
  };
}
