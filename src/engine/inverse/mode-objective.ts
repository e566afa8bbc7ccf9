/**
 * The mode-parameter misfit: for every observed mode (frequency, intensity,
 * half-width, each with its own sigma) the predicted mode is the Lorentzian
 * through three bins of the predicted spectrum (lorentz-three-point.ts) at the
 * grid bin nearest the observed frequency and ± the bin count nearest the
 * observed half-width. Residuals: (f - f_obs)/sigma_f, (ln A - ln A_obs)/sigma_lnA,
 * (g - g_obs)/sigma_g. The Jacobian chains the three-point derivatives with
 * dP/dp of the spectrum model (its 'power' variant with unit data gives P and
 * dP/dp directly). Where the predicted spectrum has no peak at those bins the
 * three-point estimate falls back smoothly to a finite one (see
 * lorentz-three-point.ts), so residuals and Jacobian are finite for every
 * parameter vector.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { COMPONENT_CODE, type DataLayout, type SeriesLayout } from './data-layout';
import { InversionInputError } from './errors';
import type { KernelSampler } from './kernel-sampler';
import { lorentzThreePoint, type ThreePointMode } from './lorentz-three-point';
import type { Parameterisation } from './parameters';
import { spectrumProblem } from './spectrum-objective';
import type { ObservedModes, StationSite } from './types';

export function modeProblem(stations: StationSite[], modes: ObservedModes[], kernel: KernelSampler, par: Parameterisation): LeastSquaresProblem & { nData: number } {
  const freqs = kernel.freqs;
  const df = freqs.length > 1 ? freqs[1] - freqs[0] : 1;
  const stationIndex = new Map(stations.map((s, i) => [s.code, i]));
  const series: SeriesLayout[] = [];
  const centres: number[] = [];
  const spans: number[] = [];
  const obs: { f: number; lnA: number; g: number; sf: number; sA: number; sg: number }[] = [];
  let offset = 0;
  modes.forEach((m, si) => {
    const where = `modes[${si}] (${m.station} ${m.component})`;
    if (!stationIndex.has(m.station)) throw new InversionInputError(`${where}: unknown station "${m.station}"`);
    if (!(m.component in COMPONENT_CODE)) throw new InversionInputError(`${where}: unknown component "${String(m.component)}"`);
    const bins: number[] = [];
    m.modes.forEach((md, k) => {
      const at = `${where}.modes[${k}]`;
      for (const [name, v] of [['frequency', md.frequency], ['intensity', md.intensity], ['halfWidth', md.halfWidth], ['sigmaFrequency', md.sigmaFrequency], ['sigmaLogIntensity', md.sigmaLogIntensity], ['sigmaHalfWidth', md.sigmaHalfWidth]] as const) {
        if (!(v > 0) || !Number.isFinite(v)) throw new InversionInputError(`${at}.${name} must be a positive number, got ${v}`);
      }
      const ic = Math.round((md.frequency - freqs[0]) / df);
      const span = Math.max(1, Math.round(md.halfWidth / df));
      if (ic - span < 0 || ic + span >= freqs.length) {
        throw new InversionInputError(`${at}: ${md.frequency} Hz ± ${md.halfWidth} Hz lies outside the band ${freqs[0]}–${freqs[freqs.length - 1]} Hz`);
      }
      bins.push(ic - span, ic, ic + span);
      centres.push(freqs[ic]);
      spans.push(span * df);
      obs.push({ f: md.frequency, lnA: Math.log(md.intensity), g: md.halfWidth, sf: md.sigmaFrequency, sA: md.sigmaLogIntensity, sg: md.sigmaHalfWidth });
    });
    const ones = new Float64Array(bins.length).fill(1);
    series.push({ station: stationIndex.get(m.station)!, component: COMPONENT_CODE[m.component], bins: Int32Array.from(bins), lnObs: new Float64Array(bins.length), obs: ones, invSigma: 1, offset });
    offset += bins.length;
  });
  const nModes = obs.length;
  if (nModes === 0) throw new InversionInputError('modes: no observed modes given');
  const layout: DataLayout = { freqs, stations, series, nData: offset };
  const power = spectrumProblem(layout, kernel, par, 'power');
  const n = power.nParams;
  const m = 3 * nModes;
  if (n > m) throw new InversionInputError(`more free parameters (${n}) than data (${m})`);
  const pr = new Float64Array(offset);
  const pj = new Float64Array(offset * n);
  const est: ThreePointMode = { frequency: 0, lnIntensity: 0, halfWidth: 0, grad: new Float64Array(9), ok: false };

  function eachMode(p: Float64Array, f: (i: number, e: ThreePointMode) => void) {
    power.residuals(p, pr);
    for (let i = 0; i < nModes; i++) {
      lorentzThreePoint(centres[i], spans[i], pr[3 * i], pr[3 * i + 1], pr[3 * i + 2], est);
      f(i, est);
    }
  }

  return {
    nParams: n,
    nResiduals: m,
    nData: m,
    lower: par.lower,
    upper: par.upper,
    residuals(p, out) {
      eachMode(p, (i, e) => {
        const o = obs[i];
        out[3 * i] = (e.frequency - o.f) / o.sf;
        out[3 * i + 1] = (e.lnIntensity - o.lnA) / o.sA;
        out[3 * i + 2] = (e.halfWidth - o.g) / o.sg;
      });
    },
    jacobian(p, out) {
      power.jacobian(p, pj);
      eachMode(p, (i, e) => {
        const o = obs[i];
        const sig = [o.sf, o.sA, o.sg];
        for (let q = 0; q < 3; q++) {
          for (let j = 0; j < n; j++) {
            let s = 0;
            for (let b = 0; b < 3; b++) s += e.grad[q * 3 + b] * pj[(3 * i + b) * n + j];
            out[(3 * i + q) * n + j] = s / sig[q];
          }
        }
      });
    },
  };
}
