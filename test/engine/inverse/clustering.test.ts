/**
 * Clustering multi-start (in the spirit of Rinnooy Kan & Timmer 1987, Math. Programming 39, 27-56, pages from
 * memory): a start of a later wave that comes close to a minimum an earlier wave found is stopped and counted in
 * it. On fixtures/cases/two-minima.json (a source and its mirror image across the equator, two minima of equal
 * misfit) the clustered multi-start spends fewer iterations, still reports both minima with the same misfits as
 * running every start to its end, counts every start once, and gives the same result on 1 and 2 threads.
 */
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { invertCaseSchema } from '@/src/engine/case';
import { inputFromCase } from '@/src/engine/case/spectrum-input';
import { basinOf } from '@/src/engine/inverse/clustering';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { closeInversionPool } from '@/src/engine/inverse/threads/pool';
import { CLUSTER_JOIN_DIST, CLUSTER_MIN_ITERATIONS } from '@/src/engine/tolerances';

afterAll(() => closeInversionPool());

describe('joining a known basin', () => {
  const bounds = { lower: Float64Array.of(0, -10), upper: Float64Array.of(10, 10) };
  const known = [{ index: 3, params: [5, 0] }];
  it('joins only within the distance (fraction of each range) and only after the first iterations', () => {
    const near = Float64Array.of(5 + 0.9 * CLUSTER_JOIN_DIST * 10, -0.9 * CLUSTER_JOIN_DIST * 20);
    const far = Float64Array.of(5 + 1.1 * CLUSTER_JOIN_DIST * 10, 0);
    expect(basinOf(near, CLUSTER_MIN_ITERATIONS, known, bounds)).toBe(3);
    expect(basinOf(near, CLUSTER_MIN_ITERATIONS - 1, known, bounds)).toBe(-1);
    expect(basinOf(far, CLUSTER_MIN_ITERATIONS, known, bounds)).toBe(-1);
  });
});

describe('clustered multi-start on the two-minima case', () => {
  const input = inputFromCase(invertCaseSchema.parse(JSON.parse(readFileSync('fixtures/cases/two-minima.json', 'utf8'))));

  it('spends fewer iterations and reports the same minima as running every start to its end', async () => {
    const all = await invertSpectra(input, { starts: 32, seed: 2, threads: 1, cluster: false });
    const some = await invertSpectra(input, { starts: 32, seed: 2, threads: 1 });
    const iterations = (r: typeof all) => r.startEnds!.iterations.reduce((a, b) => a + b, 0);
    expect(some.startEnds!.stopReason.filter((r) => r === 'clustered').length).toBeGreaterThan(0);
    expect(iterations(some)).toBeLessThan(iterations(all));
    expect(some.minima.reduce((a, m) => a + m.count, 0)).toBe(32);
    const good = (r: typeof all) => r.minima.filter((m) => m.reducedChi2 < 2).map((m) => m.misfit);
    expect(good(some)).toHaveLength(2);
    good(some).forEach((m, i) => expect(Math.abs(m - good(all)[i])).toBeLessThan(1e-6 * m));
    const two = await invertSpectra(input, { starts: 32, seed: 2, threads: 2 });
    expect(two.minima.map((m) => [m.misfit, m.startIndexes])).toEqual(some.minima.map((m) => [m.misfit, m.startIndexes]));
  });
});
