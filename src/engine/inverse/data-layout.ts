/**
 * Turns observed spectra into the flat arrays the objective works on: one
 * common frequency grid (the sorted union of the kept observed frequencies),
 * and per series its station, component, grid indexes, ln(power) and 1/sigma.
 * Mains bins (line and harmonics ± half-width) and user-excluded bands are
 * left out here. A series with Welch statistics gets sigma from K_eff, the
 * log bias removed and a whitening of its neighbouring bins' correlation
 * (bin-whitening.ts). Every bad input throws an InversionInputError naming the
 * series and bin.
 */
import type { Component } from '@/src/engine/components';
import { logPowerBias, logPowerVariance } from '@/src/engine/stats/log-power';
import { welchStatisticsProblem } from '@/src/engine/stats/welch-statistics';
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';
import { bandedWhitener, gridPositions, type BandedWhitener } from './bin-whitening';
import { InversionInputError } from './errors';
import type { BinSelection, ObservedSeries, StationSite } from './types';

export const COMPONENT_CODE: Record<Component, number> = { Ez: 0, Bns: 1, Bew: 2 };
const DEFAULT_MAINS_HALF_WIDTH_HZ = 0.5;

export interface SeriesLayout {
  station: number;
  component: number;
  /** Index into the common grid for each kept bin. */
  bins: Int32Array;
  lnObs: Float64Array;
  /** Observed power of each kept bin (for the linear-power variant). */
  obs: Float64Array;
  invSigma: number;
  /** Offset of this series' first residual. */
  offset: number;
  /** Banded whitening of the bins' correlation (series with Welch statistics; bin-whitening.ts). */
  whiten?: BandedWhitener;
}

export interface DataLayout {
  freqs: Float64Array;
  stations: StationSite[];
  series: SeriesLayout[];
  nData: number;
}

function excluded(f: number, sel: BinSelection): boolean {
  for (const b of sel.exclude ?? []) if (f >= b.minHz && f <= b.maxHz) return true;
  if (sel.mainsHz && sel.mainsHz > 0) {
    const hw = sel.mainsHalfWidthHz ?? DEFAULT_MAINS_HALF_WIDTH_HZ;
    const k = Math.max(1, Math.round(f / sel.mainsHz));
    if (Math.abs(f - k * sel.mainsHz) <= hw) return true;
  }
  return false;
}

export function buildDataLayout(stations: StationSite[], observed: ObservedSeries[], selection: BinSelection = {}): DataLayout {
  if (observed.length === 0) throw new InversionInputError('observed: no spectra given');
  const stationIndex = new Map(stations.map((s, i) => [s.code, i]));
  for (const b of selection.exclude ?? []) {
    if (!(b.minHz <= b.maxHz))
      throw new InversionInputError(`excluded band ${b.minHz}..${b.maxHz} Hz: minHz is greater than maxHz`);
  }
  const kept: { f: number[]; p: number[] }[] = observed.map((o, si) => {
    const where = `observed[${si}] (${o.station} ${o.component})`;
    if (!stationIndex.has(o.station)) throw new InversionInputError(`${where}: unknown station "${o.station}"`);
    if (!(o.component in COMPONENT_CODE))
      throw new InversionInputError(`${where}: unknown component "${String(o.component)}" (use Ez, Bns or Bew)`);
    if (o.welch) {
      const problem = welchStatisticsProblem(o.welch);
      if (problem) throw new InversionInputError(`${where}: welch.${problem}`);
      for (let k = 1; k < o.frequencies.length; k++)
        if (!(o.frequencies[k] > o.frequencies[k - 1]))
          throw new InversionInputError(
            `${where}: frequencies must increase when welch is given (bin ${k}, ${o.frequencies[k]} Hz)`,
          );
    } else if (o.sigmaLog === undefined)
      throw new InversionInputError(`${where}: sigmaLog or welch is required (the scatter of ln power)`);
    else if (!(o.sigmaLog > 0) || !Number.isFinite(o.sigmaLog))
      throw new InversionInputError(`${where}: sigmaLog must be a positive number, got ${o.sigmaLog}`);
    if (o.frequencies.length !== o.power.length) {
      throw new InversionInputError(`${where}: ${o.frequencies.length} frequencies but ${o.power.length} power values`);
    }
    const f: number[] = [];
    const p: number[] = [];
    for (let k = 0; k < o.power.length; k++) {
      const fk = o.frequencies[k];
      const pk = o.power[k];
      if (!Number.isFinite(fk) || fk <= 0)
        throw new InversionInputError(`${where}: frequency at bin ${k} must be a positive number, got ${fk}`);
      if (excluded(fk, selection)) continue;
      if (!Number.isFinite(pk) || pk <= 0)
        throw new InversionInputError(`${where}: power at bin ${k} (${fk} Hz) must be a positive number, got ${pk}`);
      f.push(fk);
      p.push(pk);
    }
    return { f, p };
  });
  const all = [...new Set(kept.flatMap((k) => k.f))].sort((a, b) => a - b);
  const freqs = Float64Array.from(all);
  const gridIndex = new Map(all.map((f, i) => [f, i]));
  let offset = 0;
  const series: SeriesLayout[] = observed.map((o, si) => {
    const { f, p } = kept[si];
    // with Welch statistics: sigma = sqrt(psi1(K_eff)) and the observed logs raised by the bias psi(K_eff) - ln K_eff
    const bias = o.welch ? logPowerBias(o.welch.effectiveAverages) : 0;
    const s: SeriesLayout = {
      station: stationIndex.get(o.station)!,
      component: COMPONENT_CODE[o.component],
      bins: Int32Array.from(f, (x) => gridIndex.get(x)!),
      lnObs: o.welch ? Float64Array.from(p, (v) => Math.log(v) - bias) : Float64Array.from(p, Math.log),
      obs: Float64Array.from(p),
      invSigma: o.welch ? 1 / Math.sqrt(logPowerVariance(o.welch.effectiveAverages)) : 1 / o.sigmaLog!,
      offset,
    };
    if (o.welch) {
      const lag = hannWelchBinCorrelation(o.welch.segments, o.welch.overlap);
      s.whiten = bandedWhitener(gridPositions(o.frequencies, f), lag);
    }
    offset += f.length;
    return s;
  });
  if (offset === 0) throw new InversionInputError('observed: every bin is excluded (mains or excluded bands); no data left');
  return { freqs, stations, series, nData: offset };
}
