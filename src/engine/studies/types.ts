/**
 * Types of the two studies, defined once and shared by the command line, the
 * worker and the UI: what a study starts from (a network's stations, a truth or
 * solution, the unknowns, the noise) and what it reports (siting: standard
 * errors with and without each candidate; recovery: bias, spread, pulls and
 * coverage of every free parameter).
 */
import type { Band } from '@/src/engine/band';
import type { CavityConfig } from '@/src/engine/cavity';
import type { Component } from '@/src/engine/components';
import type { NamedMatrix, ParamKind, RegionUnknown } from '@/src/engine/inverse/types';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';

/** A station of the studied network, with the components it records. */
export interface StudyStation {
  code: string;
  lat: number;
  lon: number;
  components: readonly Component[];
}

/** One source of the truth (recovery) or solution (siting); its name is the unknown it stands for. */
export interface StudySource {
  name: string;
  lat: number;
  lon: number;
  /** C^2 km^2 / s. */
  intensity: number;
  /** Angular spread in degrees of a spot region. */
  spreadDeg?: number;
  /** Grid-cell nodes of a region given by cells (weights add up to 1). */
  footprint?: { lat: number; lon: number; weight: number }[];
}

/** The scatter of every station series: sigma of ln power, or the Welch statistics of the spectra (which win). */
export interface StudyNoise {
  sigmaLog?: number;
  welch?: WelchStatistics;
}

export interface StudyInput {
  cavity: CavityConfig;
  band: Band;
  stations: StudyStation[];
  sources: StudySource[];
  unknowns: RegionUnknown[];
  noise: StudyNoise;
}

/** One-sigma errors per region and quantity, physical units (as `invert` reports them). */
export type RegionErrors = Record<string, Partial<Record<ParamKind, number>>>;

/** A candidate station: where, what it records, and its own sigma of ln power (default: the study's noise). */
export interface SiteCandidate {
  lat: number;
  lon: number;
  components: readonly Component[];
  sigmaLog?: number;
}

export interface SitingResult {
  baseline: { stdErrors: RegionErrors };
  candidates: (SiteCandidate & { stdErrors: RegionErrors })[];
}

/** How well one free parameter came back over the realisations. */
export interface RecoveredParameter {
  name: string;
  truth: number;
  mean: number;
  spread: number;
  pullMean: number;
  pullSpread: number;
  coverage68: number;
  coverage95: number;
}

export interface RecoveryResult {
  realisations: number;
  seed: number;
  parameters: RecoveredParameter[];
  /** Mean correlation of the parameters at the best minimum over the realisations: which of them trade off. */
  correlation: NamedMatrix;
  /** Realisations whose best minimum was singular (some combination unresolved); their pulls are left out. */
  singular: number;
  /** Mean chi-square at the best minimum, and the data less the free parameters (about equal when all is well). */
  meanMisfit: number;
  degreesOfFreedom: number;
}

export interface StudyProgress {
  done: number;
  total: number;
}

export interface StudyCallbacks {
  onProgress?: (p: StudyProgress) => void;
  shouldCancel?: () => boolean;
}
