import { describe, expect, it } from 'vitest';
import { fmt } from '@/src/web/runs/types';

// Reference: the ECMA-402 number formatter (Intl.NumberFormat, en-GB) that fmt stands in for
// inside [1e-3, 1e5), and Number.prototype.toExponential outside it.
describe('fmt', () => {
  const values: number[] = [
    0,
    1,
    -1,
    0.5,
    0.001,
    0.0012345,
    0.099999,
    1.23456,
    9.99951,
    12.5,
    99.995,
    999.95,
    1000,
    1234.5,
    12345.678,
    99994.9,
    99999.4,
    29770.942455289398,
    -4321.987,
    0.3,
    0.1 + 0.2,
    314.159265,
  ];
  for (let k = 0; k < 400; k++) values.push((k % 2 ? -1 : 1) * Math.exp(-6.9 + (18.4 * k) / 400)); // 1e-3 .. 1e5, both signs

  for (const digits of [2, 3, 5]) {
    it(`writes ${digits + 1} significant figures with commas as Intl.NumberFormat en-GB does (digits = ${digits})`, () => {
      const intl = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: digits + 1 });
      for (const v of values) {
        const a = Math.abs(v);
        const expected = a !== 0 && (a >= 1e5 || a < 1e-3) ? v.toExponential(digits - 1) : intl.format(v);
        expect(fmt(v, digits), `value ${v}`).toBe(expected);
      }
    });
  }

  it('writes a dash for missing and non-finite values', () => {
    for (const v of [undefined, null, NaN, Infinity]) expect(fmt(v)).toBe('—');
  });
});
