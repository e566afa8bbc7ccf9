/**
 * Reader for the Cavitas spectra layout (version 1): one row per frequency,
 * one power column per interval, the column named by the interval's start:
 *
 *   # cavitas-spectra 1
 *   # station: KESTREL-2
 *   # component: Bns
 *   # units: pT^2/Hz
 *   # interval-seconds: 600
 *   frequency-hz,2026-03-14T00:00:00Z,2026-03-14T00:10:00Z
 *   3.0,0.412,0.398
 *   3.1,0.409,0.401
 *
 * Frequencies increase; interval starts increase and lie at least
 * interval-seconds apart; power is a finite number >= 0. Errors name file,
 * line and field (the column's heading).
 */
import { COMPONENTS, type Component } from '@/src/engine/components';
import { FormatError } from './format-error';
import { parseNumberCell, readHeaderBlock, parseUtc, requireValue, unknownKeys } from './header-lines';
import { linesOf } from './lines';

export const SPECTRA_SIGNATURE = 'cavitas-spectra';
export const SPECTRA_FREQUENCY_COLUMN = 'frequency-hz';

export interface SpectraFile {
  station: string;
  component: Component;
  units: string;
  intervalSeconds: number;
  frequencies: Float64Array;
  intervals: { startUtc: string; startMs: number; power: Float64Array }[];
  /** Header keys this layout does not define (kept, not an error: the caller may warn). */
  unknownKeys: { key: string; line: number }[];
}

const SPECTRA_KEYS = ['station', 'component', 'units', 'interval-seconds'] as const;

export async function readSpectraCsv(
  chunks: AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>,
  file: string,
): Promise<SpectraFile> {
  const lines = linesOf(chunks);
  const { block, columnsLine } = await readHeaderBlock(lines, file, SPECTRA_SIGNATURE);
  const end = columnsLine.number;
  const station = requireValue(block, 'station', file, end).value;
  const comp = requireValue(block, 'component', file, end);
  if (!COMPONENTS.includes(comp.value as Component))
    throw new FormatError(file, comp.line, 'component', `"${comp.value}" is not one of ${COMPONENTS.join(', ')}`);
  const units = requireValue(block, 'units', file, end).value;
  const iv = requireValue(block, 'interval-seconds', file, end);
  const intervalSeconds = parseNumberCell(iv.value);
  if (intervalSeconds === null || !(intervalSeconds > 0))
    throw new FormatError(file, iv.line, 'interval-seconds', `"${iv.value}" is not a positive number`);

  const names = columnsLine.text.split(',').map((s) => s.trim());
  if (names[0] !== SPECTRA_FREQUENCY_COLUMN)
    throw new FormatError(file, end, names[0] || '(empty)', `the first column must be "${SPECTRA_FREQUENCY_COLUMN}"`);
  if (names.length < 2) throw new FormatError(file, end, null, 'no interval columns after "frequency-hz"');
  const starts: number[] = [];
  names.slice(1).forEach((name, i) => {
    const ms = parseUtc(name);
    if (ms === null)
      throw new FormatError(
        file,
        end,
        name || `(column ${i + 2})`,
        'an interval column must be headed by its start, a UTC time like 2026-03-14T00:10:00Z',
      );
    if (i > 0) {
      if (ms <= starts[i - 1]) throw new FormatError(file, end, name, `interval starts must increase (after ${names[i]})`);
      if (ms - starts[i - 1] < intervalSeconds * 1000)
        throw new FormatError(
          file,
          end,
          name,
          `overlaps the interval starting ${names[i]} (interval-seconds ${intervalSeconds})`,
        );
    }
    starts.push(ms);
  });
  const nCols = names.length;
  const freqs: number[] = [];
  const powers: number[][] = starts.map(() => []);
  for await (const line of lines) {
    if (line.text.trim() === '') continue;
    const cells = line.text.split(',');
    if (cells.length !== nCols) {
      throw new FormatError(
        file,
        line.number,
        null,
        `expected ${nCols} cells, found ${cells.length}${line.complete ? '' : ' (the file seems cut off)'}`,
      );
    }
    const f = parseNumberCell(cells[0]);
    if (f === null || f < 0)
      throw new FormatError(file, line.number, SPECTRA_FREQUENCY_COLUMN, `"${cells[0].trim()}" is not a frequency >= 0`);
    if (freqs.length && f <= freqs[freqs.length - 1])
      throw new FormatError(
        file,
        line.number,
        SPECTRA_FREQUENCY_COLUMN,
        `${f} Hz does not increase on the previous row (${freqs[freqs.length - 1]} Hz)`,
      );
    freqs.push(f);
    for (let c = 1; c < nCols; c++) {
      const v = parseNumberCell(cells[c]);
      if (v === null || v < 0) {
        const cell = cells[c].trim();
        const why = /^[+-]?nan$/i.test(cell)
          ? 'NaN is not allowed'
          : cell === ''
            ? 'the cell is empty'
            : `"${cell.slice(0, 24)}" is not a power >= 0`;
        throw new FormatError(file, line.number, names[c], why);
      }
      powers[c - 1].push(v);
    }
  }
  if (freqs.length < 2) throw new FormatError(file, end, null, 'the file needs at least two frequency rows');
  return {
    station,
    component: comp.value as Component,
    units,
    intervalSeconds,
    frequencies: Float64Array.from(freqs),
    intervals: starts.map((ms, i) => ({ startUtc: names[i + 1], startMs: ms, power: Float64Array.from(powers[i]) })),
    unknownKeys: unknownKeys(block, SPECTRA_KEYS),
  };
}
