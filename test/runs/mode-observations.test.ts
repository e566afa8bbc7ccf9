/**
 * Mode runs take the stored fits' own covariance: per mode the peak (amplitude plus background), the sd of
 * ln peak from the full covariance (background included) and the (frequency, ln peak, half-width) correlation,
 * as the fit reports them (engine/modes/peak-statistics.ts, checked there against first-order propagation).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { storedFit } from '@/src/data/interval-processing';
import { loadModeObservations } from '@/src/runs/observations';
import type { RunConfig } from '@/src/runs/config';
import { makeRunWorld, SEGMENTS, storeSpectra, truthSpectra } from './world';

describe('mode observations from stored fits', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('carry each fit’s peak, sd of ln peak and (f, ln peak, g) correlation', async () => {
    const w = await makeRunWorld(1);
    const t = new Date(w.starts[0].getTime() + 3_600_000);
    const spectra = truthSpectra(w, { minHz: 3, maxHz: 48, stepHz: 0.1 }, ['Ez']);
    const fits = spectra.map((sp) => storedFit(fitModes(sp.frequencies, sp.power, { modes: 5, averages: SEGMENTS })));
    await storeSpectra(w, spectra, t, { fit: (_, k) => fits[k] });
    const config: RunConfig = { ...w.config, observables: { kind: 'modes', modes: 3 } };
    const observed = await loadModeObservations(w.networkId, config, t);
    expect(observed).toHaveLength(3);
    observed.forEach((om) => {
      const fit = fits[spectra.findIndex((sp) => sp.station === om.station)];
      expect(om.modes.length).toBeGreaterThan(0);
      om.modes.forEach((m) => {
        const stored = fit.modes.find((x) => x.frequency === m.frequency)!;
        expect(m.intensity).toBe(stored.peak);
        expect(m.sigmaLogIntensity).toBe(stored.errors.lnPeak);
        expect(m.correlation).toEqual(stored.correlation);
        expect(m.correlation![0][0]).toBe(1);
      });
    });
  });
});
