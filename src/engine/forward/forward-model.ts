/**
 * The forward model bound to one cavity, band and station set: for any list of
 * sources it fills each station's Ez, Bns and Bew power spectra (SI). Sources are
 * incoherent, so powers add; spot regions are summed over their quadrature nodes.
 *   Ez  += I w ez(theta)
 *   Bns += I w bh(theta) sin^2(bearing),  Bew += I w bh(theta) cos^2(bearing)
 * (the horizontal magnetic field is perpendicular to the great circle). Allocation-free
 * after construction.
 */
import { bandFrequencies, type Band } from '../band';
import type { Cavity } from '../cavity/types';
import { greatCircleInto, type GreatCircle } from '../geometry/great-circle';
import { createKernelSample, getKernelTable, type KernelTable } from '../kernels/kernel-table';
import { SPOT_MAX_NODES, SPOT_STRIDE, spotNodesInto } from '../sources/spot';
import type { ForwardSource } from '../sources/types';
import type { ForwardStation } from './types';

/** Per station: Ez, Bns, Bew power arrays (length = bins). */
export type StationPower = { ez: Float64Array; bns: Float64Array; bew: Float64Array };

export interface ForwardModel {
  readonly freqs: Float64Array;
  readonly table: KernelTable;
  readonly stations: readonly ForwardStation[];
  /** Overwrites out[s] (one per station) with the predicted spectra of the given sources. */
  evaluate(sources: readonly ForwardSource[], out: StationPower[]): void;
  createOutput(): StationPower[];
}

export function createForwardModel(cavity: Cavity, band: Band | Float64Array, stations: readonly ForwardStation[]): ForwardModel {
  const freqs = band instanceof Float64Array ? band : bandFrequencies(band);
  const table = getKernelTable(cavity, freqs);
  const n = freqs.length;
  const sample = createKernelSample(n);
  const gc = {} as GreatCircle;
  const nodes = new Float64Array(SPOT_MAX_NODES * SPOT_STRIDE);
  const createOutput = (): StationPower[] =>
    stations.map(() => ({ ez: new Float64Array(n), bns: new Float64Array(n), bew: new Float64Array(n) }));
  return {
    freqs,
    table,
    stations,
    createOutput,
    evaluate(sources, out) {
      for (let s = 0; s < stations.length; s++) {
        const st = stations[s];
        const { ez, bns, bew } = out[s];
        ez.fill(0);
        bns.fill(0);
        bew.fill(0);
        for (let k = 0; k < sources.length; k++) {
          const src = sources[k];
          const count = spotNodesInto(src.lat, src.lon, src.spreadDeg ?? 0, nodes);
          for (let q = 0; q < count; q++) {
            const o = q * SPOT_STRIDE;
            const weight = src.intensity * nodes[o + 2];
            if (weight === 0) continue;
            greatCircleInto(st.lat, st.lon, nodes[o], nodes[o + 1], gc);
            table.samplePower(gc.theta, sample);
            const sb = Math.sin(gc.bearing);
            const cb = Math.cos(gc.bearing);
            const wns = weight * sb * sb;
            const wew = weight * cb * cb;
            const e = sample.ez;
            const b = sample.bh;
            for (let j = 0; j < n; j++) {
              ez[j] += weight * e[j];
              bns[j] += wns * b[j];
              bew[j] += wew * b[j];
            }
          }
        }
      }
    },
  };
}
