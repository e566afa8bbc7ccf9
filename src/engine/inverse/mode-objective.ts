/**
 * The mode-parameter misfit. Every observed mode (frequency, peak intensity,
 * half-width, each with its own sigma) came from a Lorentzian fit of an
 * observed spectrum; its prediction is the same fit of the predicted spectrum
 * (predicted-modes.ts), so that like is compared with like. Residuals per
 * mode: (f - f_obs)/sigma_f, (ln A - ln A_obs)/sigma_lnA, (g - g_obs)/sigma_g;
 * a mode that carries the correlation of the three has them (and their
 * Jacobian rows) whitened by it (mode-whitening.ts).
 * The Jacobian chains the fit's implicit derivative (fit-sensitivity.ts) with
 * dP/dp of the spectrum model (its 'power' variant with unit data gives P and
 * dP/dp directly). The fitted modes are bounded and the peak is floored
 * smoothly, so residuals and Jacobian are finite for every parameter vector.
 */
import type { Component } from '@/src/engine/components';
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { COMPONENT_CODE, type DataLayout, type SeriesLayout } from './data-layout';
import { InversionInputError } from './errors';
import type { KernelSampler } from './kernel-sampler';
import { modeWhitener, whitenTriple, whitenTripleRows, type ModeWhitener } from './mode-whitening';
import type { Parameterisation } from './parameters';
import {
  modeSeriesSetup,
  predictedModeDerivatives,
  predictedSeriesModes,
  type ModeSeriesSetup,
  type PredictedSeriesModes,
} from './predicted-modes';
import { spectrumProblem } from './spectrum-objective';
import type { ObservedModes, StationSite } from './types';

type Triple = { frequency: number; intensity: number; halfWidth: number };

/** One observed mode beside its prediction at a parameter vector (shared by the run views and the command line). */
export interface ModeComparison {
  station: string;
  component: Component;
  /** 1-based, in the order of the series' observed modes. */
  mode: number;
  observed: Triple;
  sigma: { frequency: number; logIntensity: number; halfWidth: number };
  predicted: Triple;
  /** Residuals divided by their sigmas (before a correlated mode's whitening). */
  residual: { frequency: number; logIntensity: number; halfWidth: number };
}

export interface ModeProblem extends LeastSquaresProblem {
  nData: number;
  /** Every observed mode beside its predicted counterpart at p. */
  compare(p: Float64Array): ModeComparison[];
}

export function modeProblem(
  stations: StationSite[],
  modes: ObservedModes[],
  kernel: KernelSampler,
  par: Parameterisation,
): ModeProblem {
  const stationIndex = new Map(stations.map((s, i) => [s.code, i]));
  const setups: ModeSeriesSetup[] = [];
  const series: SeriesLayout[] = [];
  const obs: { f: number; lnA: number; g: number; sf: number; sA: number; sg: number; white: ModeWhitener | null }[] = [];
  let offset = 0;
  modes.forEach((m, si) => {
    const where = `modes[${si}] (${m.station} ${m.component})`;
    if (!stationIndex.has(m.station)) throw new InversionInputError(`${where}: unknown station "${m.station}"`);
    if (!(m.component in COMPONENT_CODE)) throw new InversionInputError(`${where}: unknown component "${String(m.component)}"`);
    if (m.modes.length === 0) throw new InversionInputError(`${where}: no observed modes`);
    m.modes.forEach((md, k) => {
      const at = `${where}.modes[${k}]`;
      for (const [name, v] of [
        ['frequency', md.frequency],
        ['intensity', md.intensity],
        ['halfWidth', md.halfWidth],
        ['sigmaFrequency', md.sigmaFrequency],
        ['sigmaLogIntensity', md.sigmaLogIntensity],
        ['sigmaHalfWidth', md.sigmaHalfWidth],
      ] as const) {
        if (!(v > 0) || !Number.isFinite(v)) throw new InversionInputError(`${at}.${name} must be a positive number, got ${v}`);
      }
      const white = md.correlation ? modeWhitener(md.correlation) : null;
      if (typeof white === 'string') throw new InversionInputError(`${at}.correlation ${white}`);
      obs.push({
        f: md.frequency,
        lnA: Math.log(md.intensity),
        g: md.halfWidth,
        sf: md.sigmaFrequency,
        sA: md.sigmaLogIntensity,
        sg: md.sigmaHalfWidth,
        white,
      });
    });
    const setup = modeSeriesSetup(m, kernel.freqs, where);
    setups.push(setup);
    const nb = setup.bins.length;
    series.push({
      station: stationIndex.get(m.station)!,
      component: COMPONENT_CODE[m.component],
      bins: setup.bins,
      lnObs: new Float64Array(nb),
      obs: new Float64Array(nb).fill(1),
      invSigma: 1,
      offset,
    });
    offset += nb;
  });
  const nModes = obs.length;
  if (nModes === 0) throw new InversionInputError('modes: no observed modes given');
  const layout: DataLayout = { freqs: kernel.freqs, stations, series, nData: offset };
  const power = spectrumProblem(layout, kernel, par, 'power');
  const n = power.nParams;
  const m = 3 * nModes;
  if (n > m) throw new InversionInputError(`more free parameters (${n}) than data (${m})`);
  const pr = new Float64Array(offset);
  const pj = new Float64Array(offset * n);
  const last = new Float64Array(n).fill(NaN);
  let estimates: PredictedSeriesModes[] = [];

  function estimateAt(p: Float64Array): PredictedSeriesModes[] {
    if (p.every((v, j) => v === last[j])) return estimates;
    power.residuals(p, pr);
    estimates = setups.map((s, i) => predictedSeriesModes(s, pr.subarray(series[i].offset, series[i].offset + s.bins.length)));
    last.set(p);
    return estimates;
  }

  /** Residuals divided by their sigmas, before the per-mode whitening. */
  function scaledResiduals(p: Float64Array, out: Float64Array): void {
    let i = 0;
    for (const e of estimateAt(p)) {
      for (let k = 0; k < e.values.length; k += 3, i++) {
        const o = obs[i];
        out[3 * i] = (e.values[k] - o.f) / o.sf;
        out[3 * i + 1] = (e.values[k + 1] - o.lnA) / o.sA;
        out[3 * i + 2] = (e.values[k + 2] - o.g) / o.sg;
      }
    }
  }

  function residuals(p: Float64Array, out: Float64Array): void {
    scaledResiduals(p, out);
    for (let i = 0; i < nModes; i++) if (obs[i].white) whitenTriple(obs[i].white!, out, 3 * i);
  }

  function jacobian(p: Float64Array, out: Float64Array): void {
    const est = estimateAt(p);
    power.jacobian(p, pj);
    let row = 0;
    setups.forEach((s, si) => {
      const rows = out.subarray(row * n, (row + 3 * s.slots.length) * n);
      const off = series[si].offset;
      predictedModeDerivatives(s, est[si], pj.subarray(off * n, (off + s.bins.length) * n), n, rows);
      for (let k = 0; k < s.slots.length; k++) {
        const o = obs[row / 3 + k];
        const sig = [o.sf, o.sA, o.sg];
        for (let q = 0; q < 3; q++) for (let j = 0; j < n; j++) rows[(3 * k + q) * n + j] /= sig[q];
        if (o.white) whitenTripleRows(o.white, rows, 3 * k, n);
      }
      row += 3 * s.slots.length;
    });
  }

  function compare(p: Float64Array): ModeComparison[] {
    const r = new Float64Array(m);
    scaledResiduals(p, r);
    const out: ModeComparison[] = [];
    let i = 0;
    estimates.forEach((e, si) => {
      modes[si].modes.forEach((md, k) => {
        const o = obs[i];
        out.push({
          station: modes[si].station,
          component: modes[si].component,
          mode: k + 1,
          observed: { frequency: md.frequency, intensity: md.intensity, halfWidth: md.halfWidth },
          sigma: { frequency: o.sf, logIntensity: o.sA, halfWidth: o.sg },
          predicted: { frequency: e.values[3 * k], intensity: Math.exp(e.values[3 * k + 1]), halfWidth: e.values[3 * k + 2] },
          residual: { frequency: r[3 * i], logIntensity: r[3 * i + 1], halfWidth: r[3 * i + 2] },
        });
        i++;
      });
    });
    return out;
  }

  return { nParams: n, nResiduals: m, nData: m, lower: par.lower, upper: par.upper, residuals, jacobian, compare };
}
