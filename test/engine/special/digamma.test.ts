import { describe, expect, it } from 'vitest';
import { digamma } from '@/src/engine/special/digamma';

const EULER = 0.5772156649015329; // Euler–Mascheroni constant (A&S 6.1.3)

describe('complex digamma', () => {
  it('psi(1) = -gamma (A&S 6.3.2) and psi(1/2) = -gamma - 2 ln 2 (A&S 6.3.3)', () => {
    expect(digamma(1, 0).re).toBeCloseTo(-EULER, 14);
    expect(digamma(0.5, 0).re).toBeCloseTo(-EULER - 2 * Math.LN2, 14);
  });

  it('Im psi(1/2 + iy) = (pi/2) tanh(pi y) (A&S 6.3.12) and Im psi(1 + iy) = -1/(2y) + (pi/2) coth(pi y) (A&S 6.3.13)', () => {
    for (const y of [0.01, 0.3, 1, 4.5, 20]) {
      expect(digamma(0.5, y).im).toBeCloseTo((Math.PI / 2) * Math.tanh(Math.PI * y), 13);
      expect(digamma(1, y).im).toBeCloseTo(-1 / (2 * y) + Math.PI / 2 / Math.tanh(Math.PI * y), 12);
    }
  });

  it('obeys psi(z + 1) = psi(z) + 1/z (A&S 6.3.5) including across the reflection', () => {
    for (const [x, y] of [
      [-2.3, 0.7],
      [0.2, -0.15],
      [3.1, 5],
      [-0.9, -0.01],
    ]) {
      const a = digamma(x, y);
      const b = digamma(x + 1, y);
      const d = x * x + y * y;
      expect(b.re - a.re).toBeCloseTo(x / d, 11);
      expect(b.im - a.im).toBeCloseTo(-y / d, 11);
    }
  });
});
