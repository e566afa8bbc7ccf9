/** Tables as CSV per RFC 4180 (quoting rules of §2), expected text written out by hand. */
import { describe, expect, it } from 'vitest';
import { fileName, toCsv } from '@/src/web/ui/export';

describe('toCsv', () => {
  it('writes a header with units and quotes fields holding commas, quotes or line breaks', () => {
    const csv = toCsv(
      [
        { key: 'station', header: 'Station' },
        { key: 'f1', header: 'f1', unit: 'Hz' },
        { key: 'note', header: 'Note' },
        { key: 'at', header: 'Start' },
      ],
      [
        { station: 'NORA', f1: 7.8312345678, note: 'gusty, "wet"', at: new Date('2026-03-14T06:20:00Z') },
        { station: 'SILT', f1: Number.NaN, note: 'line1\nline2', at: null },
      ],
    );
    expect(csv).toBe(
      'Station,f1 (Hz),Note,Start\r\n' +
        'NORA,7.8312345678,"gusty, ""wet""",2026-03-14T06:20:00.000Z\r\n' +
        'SILT,,"line1\nline2",\r\n',
    );
  });

  it('makes a plain file name from a title', () => {
    expect(fileName('Power at NORA, Ez', 'svg')).toBe('power-at-nora-ez.svg');
    expect(fileName('— χ —', 'png')).toBe('cavitas.png');
  });
});
