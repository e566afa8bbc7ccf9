/**
 * Errors of fitted modes propagated from the bin scatter through the fit
 * (observed-modes.ts, first-order delta method) against a Monte Carlo of the
 * fit itself: 80 seeded log-normal noise draws (sigma 0.1 in ln power per
 * bin, independent) of one forward-model spectrum, each fitted with the
 * pipeline's fitModes; the sample standard deviation of each fitted quantity
 * is compared with the propagated sigma (the sample sd of 80 draws scatters by
 * about 1/sqrt(2 x 79) = 8 %, common practice; the fit is not linear, so the
 * check allows 30 %). fitModes' own errors go through the same propagation
 * (modes/fit-errors.ts) and must agree with the Monte Carlo as well (the fit
 * covariance (J^T W J)^-1 they replace gave 0.16–1.2 of the Monte Carlo
 * scatter, median 0.63, on such spectra at four invented stations).
 */
import { describe, expect, it } from 'vitest';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { propagatedModeErrors } from '@/src/engine/inverse/observed-modes';
import { gaussian, mulberry32 } from '@/src/engine/random';
import type { ObservedModes } from '@/src/engine/inverse/types';
import { syntheticObserved } from './helpers';

const freqs = Float64Array.from({ length: 331 }, (_, i) => 3 + 0.1 * i);
const SIGMA = 0.1;
const DRAWS = 80;

describe('propagated errors of fitted modes', () => {
  const clean = syntheticObserved([{ code: 'OM1', lat: 40, lon: -5 }], [{ lat: 6, lon: 24, intensity: 3e4 }], freqs, 0, 1);
  for (const s of clean.filter((x) => x.component !== 'Bew')) {
    it(`match a Monte Carlo of the fit (${s.component})`, () => {
      const fit = fitModes(freqs, s.power, { modes: 3, averages: 1 / SIGMA ** 2 });
      const peakOf = (f: typeof fit, k: number) =>
        f.modes[k].amplitude + f.background.b0 + f.background.b1 * f.modes[k].frequency;
      const om: ObservedModes = {
        station: 'OM1',
        component: s.component,
        fit: { modes: 3, ...fit.band },
        modes: fit.modes.map((m, k) => ({
          frequency: m.frequency,
          intensity: peakOf(fit, k),
          halfWidth: m.halfWidth,
          sigmaFrequency: 1,
          sigmaLogIntensity: 1,
          sigmaHalfWidth: 1,
        })),
      };
      const prop = propagatedModeErrors(om, freqs, s.power, { averages: 1 / SIGMA ** 2 });
      const rnd = mulberry32(4242);
      const samples = fit.modes.map(() => [[], [], [], []] as number[][]);
      for (let d = 0; d < DRAWS; d++) {
        const noisy = Array.from(s.power, (p) => p * Math.exp(SIGMA * gaussian(rnd)));
        const f = fitModes(freqs, noisy, { modes: 3, averages: 1 / SIGMA ** 2 });
        f.modes.forEach((m, k) => {
          samples[k][0].push(m.frequency);
          samples[k][1].push(Math.log(peakOf(f, k)));
          samples[k][2].push(m.halfWidth);
          samples[k][3].push(m.amplitude);
        });
      }
      const sd = (v: number[]) => {
        const mean = v.reduce((a, x) => a + x, 0) / v.length;
        return Math.sqrt(v.reduce((a, x) => a + (x - mean) ** 2, 0) / (v.length - 1));
      };
      let checked = 0;
      fit.modes.forEach((m, k) => {
        // Only resonances: not held on a bound, a positive peak in every draw.
        if (prop.onEdge[k] || !samples[k][1].every(Number.isFinite)) return;
        const mc = samples[k].map(sd);
        for (let q = 0; q < 3; q++) {
          expect(prop.sigmas[k][q] / mc[q]).toBeGreaterThan(0.7);
          expect(prop.sigmas[k][q] / mc[q]).toBeLessThan(1.3);
          checked++;
        }
        const own = [m.errors.frequency, m.errors.halfWidth, m.errors.amplitude];
        [mc[0], mc[2], mc[3]].forEach((v, q) => {
          expect(own[q] / v).toBeGreaterThan(0.7);
          expect(own[q] / v).toBeLessThan(1.3);
        });
      });
      expect(checked).toBeGreaterThanOrEqual(3);
    });
  }
});
