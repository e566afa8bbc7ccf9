/**
 * The forward model bound to one cavity, band and station set: for any list of
 * sources it fills each station's Ez, Bns and Bew power spectra (SI). Sources are
 * incoherent, so powers add; spot regions are summed over their quadrature nodes.
 *   Ez  += I w ez(theta)
 *   Bns += I w bh(theta) sin^2(bearing),  Bew += I w bh(theta) cos^2(bearing)
 * (the horizontal magnetic field is perpendicular to the great circle). Allocation-free
 * after construction (node buffers grow once to the largest source count seen).
 */
import { bandFrequencies, type Band } from '../band';
import type { Cavity } from '../cavity/types';
import { greatCircleInto, type GreatCircle } from '../geometry/great-circle';
import { getKernelTable, type KernelTable } from '../kernels/kernel-table';
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
  const gc = {} as GreatCircle;
  let nodes = new Float64Array(4 * SPOT_MAX_NODES * SPOT_STRIDE);
  let counts = new Int32Array(4);
  const createOutput = (): StationPower[] =>
    stations.map(() => ({ ez: new Float64Array(n), bns: new Float64Array(n), bew: new Float64Array(n) }));
  return {
    freqs,
    table,
    stations,
    createOutput,
    evaluate(sources, out) {
      // quadrature nodes once per source (not per station)
      if (nodes.length < sources.length * SPOT_MAX_NODES * SPOT_STRIDE)
        nodes = new Float64Array(sources.length * SPOT_MAX_NODES * SPOT_STRIDE);
      if (counts.length < sources.length) counts = new Int32Array(sources.length);
      for (let k = 0; k < sources.length; k++) {
        const src = sources[k];
        counts[k] = spotNodesInto(src.lat, src.lon, src.spreadDeg ?? 0, nodes.subarray(k * SPOT_MAX_NODES * SPOT_STRIDE));
      }
      for (let s = 0; s < stations.length; s++) {
        const st = stations[s];
        const { ez, bns, bew } = out[s];
        ez.fill(0);
        bns.fill(0);
        bew.fill(0);
        for (let k = 0; k < sources.length; k++) {
          const intensity = sources[k].intensity;
          const base = k * SPOT_MAX_NODES * SPOT_STRIDE;
          for (let q = 0; q < counts[k]; q++) {
            const o = base + q * SPOT_STRIDE;
            const weight = intensity * nodes[o + 2];
            if (weight === 0) continue;
            greatCircleInto(st.lat, st.lon, nodes[o], nodes[o + 1], gc);
            const sb = Math.sin(gc.bearing);
            const cb = Math.cos(gc.bearing);
            table.addPower(gc.theta, weight, weight * sb * sb, weight * cb * cb, ez, bns, bew);
          }
        }
      }
    },
  };
}
