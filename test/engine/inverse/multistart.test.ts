/**
 * Multi-start driver on NIST StRD BoxBOD (higher difficulty; certified values
 * from https://www.itl.nist.gov/div898/strd/nls/data/boxbod.shtml, see
 * fixtures/nist/boxbod.json): from seeded quasi-random starts over a box, the
 * best minimum is the certified one; cancellation stops the run. On the
 * interval problem of fixtures/cases/two-minima.json (which pool workers can
 * rebuild), the same seed gives the same outcomes on 1 or 2 threads.
 */
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { invertCaseSchema } from '@/src/engine/case';
import { inputFromCase } from '@/src/engine/case/spectrum-input';
import { groupMinima } from '@/src/engine/inverse/grouping';
import { haltonPoint, haltonShift, radicalInverse } from '@/src/engine/inverse/halton';
import { buildIntervalProblem, type IntervalInput } from '@/src/engine/inverse/interval-problem';
import { multiStart, type PortableProblem } from '@/src/engine/inverse/multistart';
import { resolveMultiStartOptions } from '@/src/engine/inverse/multistart-options';
import { closeInversionPool } from '@/src/engine/inverse/threads/pool';
import { curveProblem } from './curve-problem';

const box = JSON.parse(readFileSync('fixtures/nist/boxbod.json', 'utf8')) as {
  x: number[];
  y: number[];
  certified: number[];
  residualSumOfSquares: number;
};
const boxbod = { problem: curveProblem({ model: 'exp-rise', x: box.x, y: box.y, lower: [1, 0.01], upper: [1000, 5] }) };
const interval: IntervalInput = {
  kind: 'spectrum',
  input: inputFromCase(invertCaseSchema.parse(JSON.parse(readFileSync('fixtures/cases/two-minima.json', 'utf8')))),
};
const portable: PortableProblem = {
  problem: buildIntervalProblem(interval).problem,
  ref: { builder: 'interval', input: interval },
};

afterAll(() => closeInversionPool());

describe('quasi-random starts', () => {
  it('radical inverse follows van der Corput: base 2 gives 1/2, 1/4, 3/4, 1/8 (Halton 1960)', () => {
    expect([1, 2, 3, 4].map((i) => radicalInverse(i, 2))).toEqual([0.5, 0.25, 0.75, 0.125]);
    expect([1, 2, 3, 4].map((i) => radicalInverse(i, 3))).toEqual([1 / 3, 2 / 3, 1 / 9, 4 / 9]);
  });
  it('the rotated sequence is reproducible per seed and differs between seeds', () => {
    const a = haltonPoint(7, haltonShift(5, 3), new Float64Array(3));
    const b = haltonPoint(7, haltonShift(5, 3), new Float64Array(3));
    const c = haltonPoint(7, haltonShift(6, 3), new Float64Array(3));
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(Array.from(a)).not.toEqual(Array.from(c));
    for (const u of a) expect(u >= 0 && u < 1).toBe(true);
  });
});

describe('multi-start on BoxBOD', () => {
  it('finds the certified minimum as the best one', async () => {
    const one = await multiStart(boxbod, resolveMultiStartOptions({ starts: 24, seed: 3, threads: 1, cluster: false }));
    const groups = groupMinima(one, { lower: Float64Array.from([1, 0.01]), upper: Float64Array.from([1000, 5]) });
    expect(groups.reduce((s, g) => s + g.members.length, 0)).toBe(24);
    const best = groups[0].best;
    expect(Math.abs(best.params[0] - box.certified[0]) / box.certified[0]).toBeLessThan(1e-6);
    expect(Math.abs(best.params[1] - box.certified[1]) / box.certified[1]).toBeLessThan(1e-6);
    expect(Math.abs(best.chi2 - box.residualSumOfSquares) / box.residualSumOfSquares).toBeLessThan(1e-9);
  });

  it('clustered (multi-level single linkage): searches fewer starts and still reaches the certified misfit', async () => {
    const one = await multiStart(boxbod, resolveMultiStartOptions({ starts: 24, seed: 3, threads: 1 }));
    expect(one.map((o) => o.index)).toEqual(Array.from({ length: 24 }, (_, i) => i));
    expect(one.some((o) => o.stopReason === 'clustered')).toBe(true);
    const best = Math.min(...one.filter((o) => o.stopReason !== 'clustered').map((o) => o.chi2));
    expect(Math.abs(best - box.residualSumOfSquares) / box.residualSumOfSquares).toBeLessThan(1e-9);
  });

  it('reports progress for every start and stops early when cancelled', async () => {
    const seen: number[] = [];
    let calls = 0;
    const out = await multiStart(boxbod, resolveMultiStartOptions({ starts: 10, seed: 1, threads: 1, cluster: false }), {
      onProgress: (p) => seen.push(p.done),
      shouldCancel: () => ++calls > 3,
    });
    expect(seen).toEqual(Array.from({ length: 10 }, (_, i) => i + 1));
    expect(out.some((o) => o.stopReason === 'cancelled')).toBe(true);
  });
});

describe('multi-start on 2 threads', () => {
  it('gives the same outcomes in-process and on 2 pool workers', async () => {
    const one = await multiStart(portable, resolveMultiStartOptions({ starts: 12, seed: 3, threads: 1 }));
    const two = await multiStart(portable, resolveMultiStartOptions({ starts: 12, seed: 3, threads: 2, callerWorks: false }));
    expect(two.map((o) => o.index)).toEqual(one.map((o) => o.index));
    for (let i = 0; i < one.length; i++) {
      expect(Array.from(two[i].params)).toEqual(Array.from(one[i].params));
      expect(two[i].stopReason).toBe(one[i].stopReason);
    }
  });

  it('refuses threads > 1 for a problem the workers cannot rebuild', async () => {
    await expect(multiStart(boxbod, resolveMultiStartOptions({ starts: 4, seed: 1, threads: 2 }))).rejects.toThrow(
      /problem reference/,
    );
  });

  it('counts every start once and stops early when cancelled', async () => {
    const seen: number[] = [];
    let calls = 0;
    const out = await multiStart(portable, resolveMultiStartOptions({ starts: 40, seed: 9, threads: 2, cluster: false }), {
      onProgress: (p) => seen.push(p.done),
      shouldCancel: () => ++calls > 50,
    });
    // and all on the pool, without the caller computing
    const pooled = await multiStart(
      portable,
      resolveMultiStartOptions({ starts: 40, seed: 9, threads: 2, callerWorks: false, cluster: false }),
    );
    expect(pooled.map((o) => o.index)).toEqual(Array.from({ length: 40 }, (_, i) => i));
    expect(out.map((o) => o.index)).toEqual(Array.from({ length: 40 }, (_, i) => i));
    expect(seen).toEqual(Array.from({ length: 40 }, (_, i) => i + 1));
    expect(out.some((o) => o.stopReason === 'cancelled')).toBe(true);
  });

  it('passes a cancellation on to the pool workers when the caller computes no starts itself', async () => {
    const out = await multiStart(
      portable,
      resolveMultiStartOptions({ starts: 12, seed: 9, threads: 2, callerWorks: false, cluster: false }),
      {
        shouldCancel: () => true,
      },
    );
    expect(out.map((o) => o.index)).toEqual(Array.from({ length: 12 }, (_, i) => i));
    expect(out.every((o) => o.stopReason === 'cancelled')).toBe(true);
  });
});
