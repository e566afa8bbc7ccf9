/**
 * The one number formatter. Expected strings are worked out by hand from the rule (the error to two
 * significant digits and the value to the same decimal place: common practice, also ISO/IEC Guide
 * 98-3 (GUM) §7.2.6 and Taylor, An Introduction to Error Analysis, §2.2; SI prefixes per the BIPM SI
 * Brochure, 9th ed., only on one-symbol units), or taken from the ECMA-402 number formatter
 * (Intl.NumberFormat, en-GB, no grouping) for plain rounding.
 */
import { describe, expect, it } from 'vitest';
import { boundState, formatEstimate, formatMeasured, formatValue, type Rounding } from '@/src/web/ui/format';

/** Intl's text with a true minus sign and without a "−0" (the formatter writes rounded-away values as 0). */
const intlText = (nf: Intl.NumberFormat, v: number) =>
  nf
    .format(v)
    .replace(/^-(0(\.0*)?)$/, '$1')
    .replace('-', '−');

/** Values across [1e-3, 1e5) of both signs, with halves and near-decade cases that rounding gets wrong most easily. */
const VALUES = [
  0,
  1,
  -1,
  0.5,
  0.001,
  0.0012345,
  0.099999,
  1.005,
  1.23456,
  2.675,
  9.99951,
  12.5,
  99.995,
  999.95,
  1234.5,
  0.1 + 0.2,
];
for (let k = 0; k < 400; k++) VALUES.push((k % 2 ? -1 : 1) * Math.exp(-6.9 + (18.4 * k) / 400));

describe('formatMeasured', () => {
  it('rounds the error to two significant digits and the value to the same place', () => {
    expect(formatMeasured(1234.5678, 23.456)).toBe('1235 ± 23');
    expect(formatMeasured(7.834, 0.0123, 'Hz')).toBe('7.834 ± 0.012 Hz');
    expect(formatMeasured(-0.5, 0.05)).toBe('−0.500 ± 0.050');
    expect(formatMeasured(100, 288)).toBe('100 ± 290');
    expect(formatMeasured(0, 0.5)).toBe('0.00 ± 0.50');
  });

  it('keeps two significant digits when the rounded error reaches the next decade', () => {
    expect(formatMeasured(1.23, 0.0996)).toBe('1.23 ± 0.10');
    expect(formatMeasured(512.3, 99.7)).toBe('510 ± 100');
  });

  it('puts an SI prefix on a one-symbol unit', () => {
    expect(formatMeasured(0.0012346, 0.000067, 's')).toBe('1.235 ± 0.067 ms');
    expect(formatMeasured(25e3, null, 'Hz')).toBe('25.0 kHz');
    expect(formatMeasured(3.2e-12, 4e-14, 'T')).toBe('3.200 ± 0.040 pT');
  });

  it('writes a power of ten before a compound unit, never a prefix on it', () => {
    expect(formatMeasured(0.04, null, '(mV/m)²/Hz')).toBe('0.0400 (mV/m)²/Hz');
    expect(formatMeasured(0.04, 0.012, '(mV/m)²/Hz')).toBe('0.040 ± 0.012 (mV/m)²/Hz');
    expect(formatMeasured(4e-6, 1.2e-7, 'pT²/Hz')).toBe('(4.00 ± 0.12) × 10⁻⁶ pT²/Hz');
    expect(formatMeasured(12345678, 2345, 'C² km²/s')).toBe('(1.23457 ± 0.00023) × 10⁷ C² km²/s');
    expect(formatMeasured(0.04, null, '(mV/m)²/Hz')).not.toMatch(/\dm /);
  });

  it('gives a value without a usable error three significant figures', () => {
    expect(formatMeasured(0.012345)).toBe('0.0123');
    expect(formatMeasured(2.5, Number.NaN)).toBe('2.50');
    expect(formatMeasured(2.5, 0)).toBe('2.50');
    expect(formatMeasured(null)).toBe('—');
    expect(formatMeasured(Number.POSITIVE_INFINITY, 1)).toBe('—');
  });
});

describe('formatValue (a value without an uncertainty)', () => {
  // beyond 10^(digits-1) the formatter keeps every whole digit rather than writing trailing zeros
  const cases: { name: string; rounding: Rounding; intl: Intl.NumberFormatOptions; covers: (x: number) => boolean }[] = [
    ...[2, 3, 5].map((n) => ({
      name: `${n} significant figures`,
      rounding: n,
      intl: { minimumSignificantDigits: n, maximumSignificantDigits: n },
      covers: (x: number) => Math.abs(x) < 10 ** (n - 1) - 0.5,
    })),
    ...[0, 1, 3].map((n) => ({
      name: `${n} decimal places`,
      rounding: { decimals: n },
      intl: { minimumFractionDigits: n, maximumFractionDigits: n },
      covers: (x: number) => x === 0 || Math.abs(x) >= 1e-3,
    })),
  ];
  for (const c of cases) {
    it(`writes ${c.name} as Intl.NumberFormat en-GB does`, () => {
      const nf = new Intl.NumberFormat('en-GB', { ...c.intl, useGrouping: false });
      const covered = VALUES.filter(c.covers);
      expect(covered.length).toBeGreaterThan(100);
      for (const v of covered) expect(formatValue(v, '', c.rounding), `value ${v}`).toBe(intlText(nf, v));
    });
  }

  it('writes a fixed-decimal value in the unit given (no prefix), a count in full, and extremes with a power of ten', () => {
    expect(formatValue(1234, 'm', { decimals: 0 })).toBe('1234 m');
    expect(formatValue(123456, '', { decimals: 0 })).toBe('123456');
    expect(formatValue(1.5e-7, '', { decimals: 2 })).toBe('1.50 × 10⁻⁷');
    expect(formatValue(2.5e7)).toBe('2.50 × 10⁷');
    expect(formatValue(0.04, '(mV/m)²/Hz')).toBe('0.0400 (mV/m)²/Hz');
    expect(formatValue(0.04, 'V/m')).toBe('40.0 mV/m');
  });

  it('writes a dash for missing and non-finite values', () => {
    for (const v of [undefined, null, Number.NaN, Number.POSITIVE_INFINITY]) expect(formatValue(v)).toBe('—');
  });
});

describe('bounds', () => {
  const range = { min: 100, max: 1e6 };
  it('flags an estimate on its bound instead of giving it a symmetric error', () => {
    expect(boundState(100, 288, range)).toBe('at-lower');
    expect(boundState(1e6, 5, range)).toBe('at-upper');
    expect(formatEstimate(100, 288, range, 'C² km²/s')).toEqual({ text: '100 C² km²/s (at lower bound)', flag: 'at-lower' });
  });
  it('marks an error bar that crosses a bound, and leaves free estimates alone', () => {
    expect(boundState(150, 288, range)).toBe('near-lower');
    expect(boundState(999_990, 288, range)).toBe('near-upper');
    expect(boundState(5000, 288, range)).toBe('free');
    expect(boundState(5000, 288, undefined)).toBe('free');
    expect(formatEstimate(5000, 288, range, 'C² km²/s').text).toBe('5000 ± 290 C² km²/s');
  });
});
