/**
 * Interval exports. CSV quoting follows RFC 4180 §2 (fields with commas,
 * quotes or line breaks are quoted; quotes doubled).
 */
import { describe, expect, it } from 'vitest';
import { intervalsToCsv, intervalsToJson } from '@/src/data/exports';
import type { IntervalSummary } from '@/db/repo/intervals';

const mode = (f: number) => ({
  frequency: f,
  amplitude: 2e-7,
  halfWidth: 1.9,
  q: f / 3.8,
  errors: { frequency: 0.05, amplitude: 1e-8, halfWidth: 0.1 },
});
const row = (over: Partial<IntervalSummary> = {}): IntervalSummary => ({
  id: 'i1',
  stationId: 's1',
  stationCode: 'TST1',
  component: 'Ez',
  startsAt: new Date('2026-03-14T06:20:00Z'),
  durationS: 600,
  origin: 'upload',
  uploadId: null,
  rejectedShare: 0.05,
  qualityFlags: [],
  flagReason: null,
  flaggedBy: null,
  flaggedAt: null,
  fit: { modes: [mode(7.8), mode(14.1)], background: { b0: 1e-9, b1: -1e-11 }, misfit: 123.5 },
  ...over,
});

/** Minimal RFC 4180 reader, to read back what was written. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let cur: string[] = [];
  let cell = '';
  let q = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (q) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') q = false;
      else cell += ch;
    } else if (ch === '"') q = true;
    else if (ch === ',') {
      cur.push(cell);
      cell = '';
    } else if (ch === '\n') {
      cur.push(cell);
      rows.push(cur);
      cur = [];
      cell = '';
    } else cell += ch;
  }
  return rows;
}

describe('interval exports', () => {
  it('writes one row per interval with a column group per mode', () => {
    const withBand = {
      ...row().fit!,
      band: { minHz: 3, maxHz: 36.3 },
      averages: 112.7,
      excluded: [
        { minHz: 16.4, maxHz: 16.9 },
        { minHz: 49.5, maxHz: 50.5 },
      ],
    };
    const rows = parseCsv(
      intervalsToCsv([
        row(),
        row({ id: 'i2', fit: null, qualityFlags: ['fit-failed'] }),
        row({ id: 'i3', fit: withBand }),
        row({ id: 'i4', fit: { ...withBand, excluded: [] } }),
      ]),
    );
    expect(rows).toHaveLength(5);
    const h = rows[0];
    expect(h.slice(0, 3)).toEqual(['station', 'component', 'starts_at_utc']);
    expect(h.filter((c) => c.endsWith('_frequency_hz'))).toEqual(['mode1_frequency_hz', 'mode2_frequency_hz']);
    const r1 = Object.fromEntries(h.map((k, i) => [k, rows[1][i]]));
    expect(r1.starts_at_utc).toBe('2026-03-14T06:20:00.000Z');
    expect(Number(r1.mode2_frequency_hz)).toBe(14.1);
    expect(Number(r1.mode1_q)).toBeCloseTo(7.8 / 3.8, 12);
    const r2 = Object.fromEntries(h.map((k, i) => [k, rows[2][i]]));
    expect(r2.quality_flags).toBe('fit-failed');
    expect(r2.mode1_frequency_hz).toBe('');
    // the fitted band and averages where the fit recorded them, empty for older fits
    expect(r1.fit_min_hz).toBe('');
    const r3 = Object.fromEntries(h.map((k, i) => [k, rows[3][i]]));
    expect([r3.fit_min_hz, r3.fit_max_hz, r3.fit_averages]).toEqual(['3', '36.3', '112.7']);
    // excluded ranges as min-max pairs joined by ';' (reads back to the ranges), empty when not recorded
    expect(r1.fit_excluded_hz).toBe('');
    expect(r3.fit_excluded_hz.split(';').map((p) => p.split('-').map(Number))).toEqual([
      [16.4, 16.9],
      [49.5, 50.5],
    ]);
    const r4 = Object.fromEntries(h.map((k, i) => [k, rows[4][i]]));
    expect(r4.fit_excluded_hz).toBe('none');
  });

  it('quotes reasons with commas, quotes and line breaks so they read back unchanged', () => {
    const reason = 'mower, "loud"\nnext door';
    const rows = parseCsv(intervalsToCsv([row({ flagReason: reason })]));
    const i = rows[0].indexOf('flag_reason');
    expect(rows[1][i]).toBe(reason);
    expect(rows).toHaveLength(2);
  });

  it('JSON names the units and keeps the fits', () => {
    const out = intervalsToJson('n1', [row()]);
    expect(out.units.Ez).toBe('(V/m)^2/Hz');
    expect(out.intervals[0].fit?.modes[1].frequency).toBe(14.1);
  });
});
