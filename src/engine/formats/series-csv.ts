/**
 * Reader for the Cavitas station time-series layout (version 1):
 *
 *   # cavitas-series 1
 *   # station: KESTREL-2
 *   # sample-rate-hz: 200
 *   # start-utc: 2026-03-14T00:00:00Z
 *   # units: Ez=mV/m, Bns=pT, Bew=pT
 *   seconds,Ez,Bns,Bew
 *   0,0.0123,-1.204,0.331
 *   0.005,0.0119,-1.198,0.329
 *
 * `seconds` counts from start-utc and must fall on the sample grid; rows must
 * step forward by one sample (missing rows are a gap, never a reversal).
 * The reader is streaming: it hands out blocks of contiguous samples and
 * holds at most one block in memory. Errors name file, line and field.
 */
import { COMPONENTS, type Component } from '@/src/engine/components';
import { FormatError } from './format-error';
import { parseNumberCell, readHeaderBlock, parseUtc, requireValue, unknownKeys, type HeaderBlock } from './header-lines';
import { linesOf, type TextLine } from './lines';

export const SERIES_SIGNATURE = 'cavitas-series';
export const SERIES_TIME_COLUMN = 'seconds';
/** How far (in samples) a time may sit off the sample grid before it is an error. */
const GRID_SLACK = 1e-3;

export interface SeriesHeader {
  station: string;
  sampleRateHz: number;
  startUtc: string;
  startMs: number;
  /** Component columns in file order. */
  components: Component[];
  units: Partial<Record<Component, string>>;
  /** Header keys this layout does not define (kept, not an error: the caller may warn). */
  unknownKeys: { key: string; line: number }[];
}

const SERIES_KEYS = ['station', 'sample-rate-hz', 'start-utc', 'units'] as const;

/** Contiguous samples: column c holds components[c] for samples firstSample .. firstSample + length - 1. */
export interface SeriesBlock {
  firstSample: number;
  length: number;
  columns: Float64Array[];
}

export interface SeriesReader {
  header: SeriesHeader;
  blocks: AsyncGenerator<SeriesBlock>;
}

function parseHeader(block: HeaderBlock, columnsLine: TextLine, file: string): SeriesHeader {
  const end = columnsLine.number;
  const station = requireValue(block, 'station', file, end);
  if (!/^[A-Za-z0-9][A-Za-z0-9_-]{0,23}$/.test(station.value)) {
    throw new FormatError(
      file,
      station.line,
      'station',
      `"${station.value}" is not a station code (letters, digits, - and _, up to 24)`,
    );
  }
  const rate = requireValue(block, 'sample-rate-hz', file, end);
  const sampleRateHz = parseNumberCell(rate.value);
  if (sampleRateHz === null || !(sampleRateHz > 0))
    throw new FormatError(file, rate.line, 'sample-rate-hz', `"${rate.value}" is not a positive number`);
  const start = requireValue(block, 'start-utc', file, end);
  const startMs = parseUtc(start.value);
  if (startMs === null)
    throw new FormatError(file, start.line, 'start-utc', `"${start.value}" is not a UTC time like 2026-03-14T00:00:00Z`);
  const unitsLine = requireValue(block, 'units', file, end);
  const units: Partial<Record<Component, string>> = {};
  for (const part of unitsLine.value.split(',')) {
    const m = /^\s*(\w+)\s*=\s*(\S.*?)\s*$/.exec(part);
    if (!m || !COMPONENTS.includes(m[1] as Component)) {
      throw new FormatError(
        file,
        unitsLine.line,
        'units',
        `"${part.trim()}" should read component=unit with component one of ${COMPONENTS.join(', ')}`,
      );
    }
    units[m[1] as Component] = m[2];
  }
  const names = columnsLine.text.split(',').map((s) => s.trim());
  if (names[0] !== SERIES_TIME_COLUMN)
    throw new FormatError(file, end, names[0] || '(empty)', `the first column must be "${SERIES_TIME_COLUMN}"`);
  if (names.length < 2) throw new FormatError(file, end, null, 'no component columns after "seconds"');
  const components: Component[] = [];
  for (const name of names.slice(1)) {
    if (!COMPONENTS.includes(name as Component))
      throw new FormatError(file, end, name, `unknown column; components are ${COMPONENTS.join(', ')}`);
    if (components.includes(name as Component)) throw new FormatError(file, end, name, 'column appears twice');
    if (!units[name as Component]) throw new FormatError(file, unitsLine.line, 'units', `no unit given for column ${name}`);
    components.push(name as Component);
  }
  for (const c of Object.keys(units)) {
    if (!components.includes(c as Component))
      throw new FormatError(file, unitsLine.line, 'units', `names ${c} but the file has no ${c} column`);
  }
  return {
    station: station.value,
    sampleRateHz,
    startUtc: start.value,
    startMs,
    components,
    units,
    unknownKeys: unknownKeys(block, SERIES_KEYS),
  };
}

export async function openSeriesCsv(
  chunks: AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>,
  file: string,
  options: { blockSamples?: number } = {},
): Promise<SeriesReader> {
  const lines = linesOf(chunks);
  const { block, columnsLine } = await readHeaderBlock(lines, file, SERIES_SIGNATURE);
  const header = parseHeader(block, columnsLine, file);
  const blockSamples = options.blockSamples ?? 65536;
  return { header, blocks: readBlocks(lines, header, file, blockSamples, columnsLine.number) };
}

async function* readBlocks(
  lines: AsyncGenerator<TextLine>,
  header: SeriesHeader,
  file: string,
  blockSamples: number,
  columnsLineNo: number,
): AsyncGenerator<SeriesBlock> {
  const nc = header.components.length;
  const fs = header.sampleRateHz;
  let cols = Array.from({ length: nc }, () => new Float64Array(blockSamples));
  let len = 0;
  let first = -1;
  let prev = -1;
  let prevTime = NaN;
  let rows = 0;
  const flush = (): SeriesBlock => {
    const out = { firstSample: first, length: len, columns: cols.map((c) => c.subarray(0, len)) };
    cols = Array.from({ length: nc }, () => new Float64Array(blockSamples));
    len = 0;
    return out;
  };
  for await (const line of lines) {
    if (line.text.trim() === '') continue;
    const cells = line.text.split(',');
    if (cells.length !== nc + 1) {
      const why = line.complete ? '' : ' (the file seems cut off)';
      throw new FormatError(
        file,
        line.number,
        null,
        `expected ${nc + 1} cells (seconds,${header.components.join(',')}), found ${cells.length}${why}`,
      );
    }
    const t = parseNumberCell(cells[0]);
    if (t === null || t < 0)
      throw new FormatError(file, line.number, SERIES_TIME_COLUMN, `"${cells[0].trim()}" is not a time in seconds >= 0`);
    const exact = t * fs;
    const index = Math.round(exact);
    if (Math.abs(exact - index) > GRID_SLACK) {
      throw new FormatError(
        file,
        line.number,
        SERIES_TIME_COLUMN,
        `${t} s is not on the ${fs} Hz sample grid (step from the previous row: ${(t - prevTime).toPrecision(6)} s); does sample-rate-hz match the data?`,
      );
    }
    if (prev >= 0 && index <= prev) {
      throw new FormatError(
        file,
        line.number,
        SERIES_TIME_COLUMN,
        `${t} s is not after the previous row (${prevTime} s): rows overlap or are out of order`,
      );
    }
    if (rows === 1 && index !== prev + 1) {
      throw new FormatError(
        file,
        line.number,
        SERIES_TIME_COLUMN,
        `the first rows are ${(t - prevTime).toPrecision(6)} s apart but sample-rate-hz ${fs} means ${(1 / fs).toPrecision(6)} s`,
      );
    }
    if (len > 0 && (index !== prev + 1 || len === blockSamples)) yield flush();
    if (len === 0) first = index;
    for (let c = 0; c < nc; c++) {
      const v = parseNumberCell(cells[c + 1]);
      if (v === null) {
        const cell = cells[c + 1].trim();
        const why = /^[+-]?nan$/i.test(cell)
          ? 'NaN is not allowed (leave the rows out to mark a gap)'
          : cell === ''
            ? 'the cell is empty'
            : `"${cell.slice(0, 24)}" is not a number`;
        throw new FormatError(file, line.number, header.components[c], why);
      }
      cols[c][len] = v;
    }
    len++;
    rows++;
    prev = index;
    prevTime = t;
  }
  if (rows === 0) throw new FormatError(file, columnsLineNo, null, 'the file has no data rows');
  if (len > 0) yield flush();
}
