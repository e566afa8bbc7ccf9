import { Matrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { modeWhitener, whitenTriple, whitenTripleRows } from '@/src/engine/inverse/mode-whitening';

describe('whitening of one mode (frequency, ln peak, half-width)', () => {
  const r = [
    [1, 0.3, -0.6],
    [0.3, 1, -0.2],
    [-0.6, -0.2, 1],
  ];
  it('gives r^T R^-1 r and J^T R^-1 J as a dense inverse does (ml-matrix)', () => {
    const l = modeWhitener(r);
    if (typeof l === 'string') throw new Error(l);
    const v = Float64Array.from([0, 0.7, -1.2, 0.4, 0]);
    whitenTriple(l, v, 1);
    const x = Matrix.columnVector([0.7, -1.2, 0.4]);
    const ref = x
      .transpose()
      .mmul(inverse(new Matrix(r)))
      .mmul(x)
      .get(0, 0);
    expect(v[1] ** 2 + v[2] ** 2 + v[3] ** 2).toBeCloseTo(ref, 12);
    expect(v[0]).toBe(0);
    const jac = Float64Array.from([9, 9, 1, 2, 3, -1, 0.5, 2, 9, 9]); // rows 1..3 of a 2-column Jacobian
    whitenTripleRows(l, jac, 1, 2);
    const jm = new Matrix([
      [1, 2],
      [3, -1],
      [0.5, 2],
    ]);
    const jr = jm
      .transpose()
      .mmul(inverse(new Matrix(r)))
      .mmul(jm);
    for (let a = 0; a < 2; a++)
      for (let b = 0; b < 2; b++) {
        let s = 0;
        for (let k = 1; k <= 3; k++) s += jac[2 * k + a] * jac[2 * k + b];
        expect(s).toBeCloseTo(jr.get(a, b), 12);
      }
  });
  it('says what is wrong with a matrix that is not a correlation', () => {
    expect(
      modeWhitener([
        [1, 0, 0],
        [0, 1, 0],
      ]),
    ).toMatch(/3x3/);
    expect(
      modeWhitener([
        [2, 0, 0],
        [0, 1, 0],
        [0, 0, 1],
      ]),
    ).toMatch(/diagonal/);
    expect(
      modeWhitener([
        [1, 0.5, 0],
        [0.4, 1, 0],
        [0, 0, 1],
      ]),
    ).toMatch(/symmetric/);
    expect(
      modeWhitener([
        [1, 0.9, 0.9],
        [0.9, 1, -0.9],
        [0.9, -0.9, 1],
      ]),
    ).toMatch(/positive definite/);
  });
});
