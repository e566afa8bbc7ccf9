/**
 * A stored interval result of the size a long run produces (many starts, several minima, three
 * moving regions: nine parameters), made up without solving: the load benchmark and the run
 * summary's tests store 144 of them to get a run of the size the run page must open quickly.
 * The numbers are shaped like a result (partitioned starts, symmetric matrices with a unit
 * diagonal), not a solution of anything.
 */
import { mulberry32 } from '@/src/engine/random';
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';

const KINDS = ['intensity', 'lat', 'lon'] as const;

export function largeResult(opts: { regions: string[]; starts: number; minima: number; seed: number }): InversionResult {
  const rand = mulberry32(opts.seed);
  const names = opts.regions.flatMap((r) => KINDS.map((k) => `${r}.${k}`));
  const n = names.length;
  const matrix = () => {
    const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) m[i][j] = m[j][i] = i === j ? 1 : 2 * rand() - 1;
    return m;
  };
  // Starts dealt to the minima, the best minimum taking the most.
  const owner = Array.from({ length: opts.starts }, () => Math.min(opts.minima - 1, Math.floor(opts.minima * rand() ** 2)));
  const minima: Minimum[] = Array.from({ length: opts.minima }, (_, k) => {
    const startIndexes = owner.flatMap((o, s) => (o === k ? [s] : []));
    const sources = opts.regions.map((name) => ({
      name,
      lat: 40 * rand() - 20,
      lon: 360 * rand() - 180,
      intensity: 1e3 + 1e5 * rand(),
    }));
    return {
      misfit: 1000 * (1 + k) + 100 * rand(),
      reducedChi2: 1 + k + rand(),
      count: startIndexes.length,
      startIndexes,
      sources,
      params: Object.fromEntries(sources.flatMap((s) => KINDS.map((q) => [`${s.name}.${q}`, s[q]]))),
      internal: sources.flatMap((s) => [Math.log(s.intensity), s.lat, s.lon]),
      stdErrors: Object.fromEntries(sources.map((s) => [s.name, { intensity: 0.05 * s.intensity, lat: rand(), lon: rand() }])),
      correlation: { names, matrix: matrix() },
      resolution: { names, matrix: matrix() },
      singular: false,
      rank: n,
      stopReasons: { 'misfit-change': startIndexes.length },
    };
  });
  return {
    starts: opts.starts,
    seed: opts.seed,
    seconds: 1 + rand(),
    nData: 3000,
    nParams: n,
    paramNames: names,
    unconverged: 0,
    minima,
    startEnds: {
      index: owner.map((_, s) => s),
      misfit: owner.map((o) => minima[o].misfit * (1 + 1e-6 * rand())),
      iterations: owner.map(() => 5 + Math.floor(40 * rand())),
      stopReason: owner.map(() => 'misfit-change' as const),
      minimum: owner,
    },
  };
}
