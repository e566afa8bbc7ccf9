/**
 * The ranges a mode fit reports as left out, and a second fit on the same grid
 * that leaves out those ranges uses exactly the same bins. Expected bins come
 * from the notch rule of line suppression, |f - line| <= half-width, worked by
 * hand on a 0.1 Hz grid with lines placed between bins (so no bin sits on a
 * notch edge): a 16.65 Hz line with a 0.3 Hz half-width covers 16.4–16.9 Hz,
 * 50 Hz mains with 0.5 Hz covers 49.5–50.5 Hz.
 */
import { describe, expect, it } from 'vitest';
import { excludedRanges, inExcludedRange } from '@/src/engine/modes/excluded-ranges';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { modeSeriesSetup } from '@/src/engine/inverse/predicted-modes';
import { listedLines, suppressLines } from '@/src/engine/signal/line-suppression';
import { FIVE_MODES, lorentzSum } from './synthetic';

const freqs = Float64Array.from({ length: 551 }, (_, i) => i / 10); // 0–55 Hz, as a 10 s Welch segment's bins
const power = Float64Array.from(freqs, (f) => lorentzSum(FIVE_MODES, Math.max(f, 0.5)));

describe('excluded ranges of a mode fit', () => {
  it('are the runs of left-out bins inside the band', () => {
    const lines = listedLines([
      { frequencyHz: 16.65, halfWidthHz: 0.3 },
      { frequencyHz: 50, halfWidthHz: 0.5 },
      { frequencyHz: 1.05, halfWidthHz: 0.3 },
    ]);
    const { suppressed } = suppressLines(freqs, power, lines);
    const r = excludedRanges(freqs, suppressed, 3, 52);
    // the 1.05 Hz line lies below the band and is not reported
    expect(r).toHaveLength(2);
    expect(r[0].minHz).toBeCloseTo(16.4, 12);
    expect(r[0].maxHz).toBeCloseTo(16.9, 12);
    expect(r[1].minHz).toBeCloseTo(49.5, 12);
    expect(r[1].maxHz).toBeCloseTo(50.5, 12);
    // a band edge inside a notch cuts the range there
    const cut = excludedRanges(freqs, suppressed, 3, 50.05);
    expect(cut[1].maxHz).toBeCloseTo(50, 12);
    expect(excludedRanges(freqs, undefined, 3, 52)).toEqual([]);
    expect(inExcludedRange(16.4, r) && inExcludedRange(16.9, r) && inExcludedRange(50.5, r)).toBe(true);
    expect(inExcludedRange(16.3, r) || inExcludedRange(17, r) || inExcludedRange(49.4, r)).toBe(false);
  });

  it('come with every fit: the bins left out, or none', () => {
    const { suppressed } = suppressLines(freqs, power, listedLines([{ frequencyHz: 16.65, halfWidthHz: 0.3 }]));
    const fit = fitModes(freqs, power, { modes: 5, exclude: suppressed });
    expect(fit.excluded.map((x) => [x.minHz, x.maxHz].map((v) => Math.round(v * 10) / 10))).toEqual([[16.4, 16.9]]);
    // 6 bins left out: dof = bins in band - 6 - parameters (5 modes x 3 + 2)
    const inBand = Array.from(freqs).filter((f) => f >= fit.band.minHz && f <= fit.band.maxHz).length;
    expect(fit.dof).toBe(inBand - 6 - 17);
    expect(fitModes(freqs, power, { modes: 5 }).excluded).toEqual([]);
  });

  it("make the predicted modes' fit use the observed fit's bins", () => {
    const { suppressed } = suppressLines(freqs, power, listedLines([{ frequencyHz: 16.65, halfWidthHz: 0.3 }]));
    const fit = fitModes(freqs, power, { modes: 5, exclude: suppressed });
    const observed = {
      station: 'XR1',
      component: 'Ez' as const,
      modes: [
        {
          frequency: fit.modes[0].frequency,
          intensity: 1,
          halfWidth: 1,
          sigmaFrequency: 1,
          sigmaLogIntensity: 1,
          sigmaHalfWidth: 1,
        },
      ],
    };
    const used = Array.from(freqs.keys()).filter(
      (i) => freqs[i] >= fit.band.minHz && freqs[i] <= fit.band.maxHz && !suppressed[i],
    );
    const setup = modeSeriesSetup({ ...observed, fit: { modes: 5, ...fit.band, excludeRanges: fit.excluded } }, freqs, 'XR1 Ez');
    expect(Array.from(setup.bins)).toEqual(used);
    // nothing recorded as left out: every bin of the band
    const all = modeSeriesSetup({ ...observed, fit: { modes: 5, ...fit.band, excludeRanges: [] } }, freqs, 'XR1 Ez');
    expect(all.bins.length).toBe(used.length + 6);
  });
});
