/**
 * Run set-up: date-times are ISO 8601 in UTC on a 24-hour clock (ISO 8601-1:2019, §5.4), the
 * default span is the whole last stored UTC day, and bin thinning is worded as an English ordinal.
 */
import { describe, expect, it } from 'vitest';
import { defaultSpan, local, utc } from '@/src/web/runs/RunLauncher';
import { ordinal } from '@/src/web/ui/format';

describe('run set-up date-times', () => {
  it('shows stored date-times as "YYYY-MM-DD hh:mm" and reads them back as UTC', () => {
    expect(local('2026-03-14T18:40:00.000Z')).toBe('2026-03-14 18:40');
    expect(utc('2026-03-14 18:40')).toBe('2026-03-14T18:40:00.000Z');
    expect(utc('2026-03-14T06:05')).toBe('2026-03-14T06:05:00.000Z');
    expect(utc('14/03/2026 6pm')).toBe('14/03/2026 6pm'); // passed on for the schema to refuse by name
  });

  it('defaults to the whole last stored day', () => {
    expect(defaultSpan({ first: '2026-03-12T00:00:00.000Z', last: '2026-03-14T23:50:00.000Z' })).toEqual({
      from: '2026-03-14 00:00',
      to: '2026-03-14 23:50',
    });
    expect(defaultSpan({ first: '2026-03-14T06:10:00.000Z', last: '2026-03-14T23:50:00.000Z' })).toEqual({
      from: '2026-03-14 06:10',
      to: '2026-03-14 23:50',
    });
    expect(defaultSpan({ first: null, last: null })).toEqual({ from: '', to: '' });
  });

  it('writes ordinals in plain English', () => {
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 102, 111].map(ordinal)).toEqual([
      '1st',
      '2nd',
      '3rd',
      '4th',
      '11th',
      '12th',
      '13th',
      '21st',
      '22nd',
      '102nd',
      '111th',
    ]);
  });
});
