import { describe, expect, it } from 'vitest';
import { bandFrequencies } from '@/src/engine/band';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { createForwardModel } from '@/src/engine/forward/forward-model';
import type { ForwardStation } from '@/src/engine/forward/types';
import { greatCircle } from '@/src/engine/geometry/great-circle';
import { createKernelSample } from '@/src/engine/kernels/kernel-table';
import { spotNodes } from '@/src/engine/sources/spot';
import type { ForwardSource } from '@/src/engine/sources/types';

const cavity = resolveCavity({ model: 'linear', earthRadiusKm: 6371, heightKm: 60 });
const freqs = bandFrequencies({ minHz: 5, maxHz: 30, stepHz: 0.5 });
const all = ['Ez', 'Bns', 'Bew'] as const;
// Invented sites.
const stations: ForwardStation[] = [
  { code: 'A', lat: 41, lon: -7, components: all },
  { code: 'B', lat: -33, lon: 150, components: all },
];

describe('forward model with moving spot regions', () => {
  it('equals the node-by-node sum of incoherent powers, Ez += I w ez, Bns += I w bh sin^2 b, Bew += I w bh cos^2 b (Radon 7-point rule nodes)', () => {
    const model = createForwardModel(cavity, freqs, stations);
    const out = model.createOutput();
    const sample = createKernelSample(freqs.length);
    const sources: ForwardSource[] = [
      { lat: 2, lon: -60, intensity: 3e4, spreadDeg: 6 },
      { lat: 5, lon: 20, intensity: 5e4 },
      { lat: -3, lon: 178, intensity: 2e4, spreadDeg: 9 },
      { lat: 12, lon: 95, intensity: 1e4, spreadDeg: 3 },
      { lat: -20, lon: 130, intensity: 7e3, spreadDeg: 2 },
    ];
    // twice: the second call reuses the grown node buffers and must overwrite, not add
    for (let pass = 0; pass < 2; pass++) {
      model.evaluate(sources, out);
      stations.forEach((st, s) => {
        const ez = new Float64Array(freqs.length);
        const bns = new Float64Array(freqs.length);
        const bew = new Float64Array(freqs.length);
        for (const src of sources) {
          for (const node of spotNodes(src.lat, src.lon, src.spreadDeg ?? 0)) {
            const w = src.intensity * node.weight;
            const g = greatCircle(st.lat, st.lon, node.lat, node.lon);
            model.table.samplePower(g.theta, sample);
            const sb = Math.sin(g.bearing);
            const cb = Math.cos(g.bearing);
            for (let j = 0; j < freqs.length; j++) {
              ez[j] += w * sample.ez[j];
              bns[j] += w * sb * sb * sample.bh[j];
              bew[j] += w * cb * cb * sample.bh[j];
            }
          }
        }
        for (let j = 0; j < freqs.length; j++) {
          expect(out[s].ez[j]).toBe(ez[j]);
          expect(out[s].bns[j]).toBe(bns[j]);
          expect(out[s].bew[j]).toBe(bew[j]);
        }
      });
    }
  });
});
