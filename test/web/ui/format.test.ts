/**
 * The one number formatter for measured values. Expected strings are worked out by hand from the
 * rule (error to two significant digits, value to the same decimal place: common practice, e.g.
 * Taylor, An Introduction to Error Analysis, §2.2; SI prefixes per the BIPM SI Brochure, 9th ed.,
 * only on one-symbol units).
 */
import { describe, expect, it } from 'vitest';
import { boundState, formatEstimate, formatMeasured } from '@/src/web/ui/format';

describe('formatMeasured', () => {
  it('rounds the error to two significant digits and the value to the same place', () => {
    expect(formatMeasured(1234.5678, 23.456)).toBe('1235 ± 23');
    expect(formatMeasured(7.834, 0.0123, 'Hz')).toBe('7.834 ± 0.012 Hz');
    expect(formatMeasured(-0.5, 0.05)).toBe('−0.500 ± 0.050');
    expect(formatMeasured(100, 288)).toBe('100 ± 290');
    expect(formatMeasured(0, 0.5)).toBe('0.00 ± 0.50');
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
