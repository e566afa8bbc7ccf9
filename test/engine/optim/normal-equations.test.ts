import { describe, expect, it } from 'vitest';
import { accumulateNormalEquations } from '@/src/engine/optim/normal-equations';

// Definition of the normal equations (common practice): (J^T J)_ab = sum_i J_ia J_ib and
// (J^T r)_a = sum_i J_ia r_i, summed over the rows in order; exact zeros of J contribute nothing.
function byDefinition(jac: Float64Array, r: Float64Array, m: number, n: number) {
  const jtj = new Float64Array(n * n);
  const jtr = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    for (let i = 0; i < m; i++) if (jac[i * n + a] !== 0) jtr[a] += jac[i * n + a] * r[i];
    for (let b = 0; b < n; b++)
      for (let i = 0; i < m; i++)
        if (jac[i * n + a] !== 0 && jac[i * n + b] !== 0) jtj[a * n + b] += jac[i * n + a] * jac[i * n + b];
  }
  return { jtj, jtr };
}

function seeded(seed: number) {
  let s = seed >>> 0;
  return () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

describe('accumulateNormalEquations', () => {
  it('matches the row-ordered definition bit for bit, zeros included', () => {
    for (const [m, n] of [
      [1, 1],
      [7, 3],
      [50, 9],
      [33, 5],
    ]) {
      const rnd = seeded(m * 31 + n);
      const jac = Float64Array.from({ length: m * n }, () => (rnd() < 0.2 ? 0 : (rnd() - 0.5) * 10 ** (6 * rnd() - 3)));
      const r = Float64Array.from({ length: m }, () => rnd() - 0.5);
      const jtj = new Float64Array(n * n).fill(NaN);
      const jtr = new Float64Array(n).fill(NaN);
      accumulateNormalEquations(jac, r, m, n, jtj, jtr);
      const ref = byDefinition(jac, r, m, n);
      expect(Array.from(jtj)).toEqual(Array.from(ref.jtj));
      expect(Array.from(jtr)).toEqual(Array.from(ref.jtr));
    }
  });

  it('skips exact zeros beside an infinite entry (0 x Infinity adds nothing)', () => {
    // J = [[0, Inf], [1, 2]], r = [1, 1]
    const jtj = new Float64Array(4);
    const jtr = new Float64Array(2);
    accumulateNormalEquations(Float64Array.from([0, Infinity, 1, 2]), Float64Array.from([1, 1]), 2, 2, jtj, jtr);
    expect(jtj[0]).toBe(1);
    expect(jtj[1]).toBe(2);
    expect(jtj[2]).toBe(2);
    expect(jtj[3]).toBe(Infinity);
    expect(jtr[0]).toBe(1);
    expect(jtr[1]).toBe(Infinity);
  });
});
