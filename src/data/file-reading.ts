/**
 * Station files as the data area reads them, on top of the engine's parsers:
 * which layout a file is, a full check at upload time (against the station it
 * is uploaded to), and the stream of raw intervals the worker processes.
 *
 * Layouts: the time-series CSV ("# cavitas-series 1"), the spectra CSV
 * ("# cavitas-spectra 1"), and the JSON series of the `spectrum` command
 * with three more fields for uploads: "station", "component", "startUtc".
 */
import { FormatError } from '@/src/engine/formats/format-error';
import { openSeriesCsv, SERIES_SIGNATURE, type SeriesHeader } from '@/src/engine/formats/series-csv';
import { readSpectraCsv, SPECTRA_SIGNATURE } from '@/src/engine/formats/spectra-csv';
import { parseJsonText } from '@/src/engine/formats/json-text';
import { parseSeriesJson } from '@/src/engine/formats/pipeline-json';
import { parseUtc } from '@/src/engine/formats/header-lines';
import { splitIntervals } from '@/src/engine/pipeline/interval-splitter';
import { getStationByCode, type Station } from '@/db/repo/stations';
import type { UploadFormat } from '@/db/repo/uploads';
import { textOf } from './text';
import { INTERVAL_SECONDS, sampleUnitFactor, spectrumUnitFactor, type RawInterval } from './interval-processing';
import { COMPONENTS, type Component } from '@/src/engine/components';
import { outsideSampleWindow } from './limits';
import { SIGNAL_SEGMENT_SECONDS } from '@/src/engine/tolerances';

/** A problem with a file's content: the message names file, line and field. */
export class FileProblem extends Error {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message);
  }
}

export interface FileContext {
  fileName: string;
  station: Station;
}
type Chunks = AsyncIterable<Uint8Array>;

function problem(e: unknown): never {
  if (e instanceof FormatError) throw new FileProblem(e.message, e.field ?? 'file');
  throw e;
}

/** Which layout a file uses, from its first bytes (and name, for the message). */
export function sniffFormat(fileName: string, head: string): UploadFormat {
  const text = head.replace(/^\uFEFF/, '').trimStart();
  if (text.startsWith('{')) return 'series-json';
  const first = text.split(/\r?\n/, 1)[0].replace(/\s+/g, ' ').trim();
  if (first.startsWith(`# ${SERIES_SIGNATURE}`) || first.startsWith(`#${SERIES_SIGNATURE}`)) return 'series-csv';
  if (first.startsWith(`# ${SPECTRA_SIGNATURE}`) || first.startsWith(`#${SPECTRA_SIGNATURE}`)) return 'spectra-csv';
  throw new FileProblem(
    `${fileName}, line 1: not a Cavitas station file — the first line should read "# ${SERIES_SIGNATURE} 1" or "# ${SPECTRA_SIGNATURE} 1", or the file should be a JSON series starting with "{"`,
    'file',
  );
}

async function checkStationCode(code: string, ctx: FileContext, field: string): Promise<void> {
  if (code === ctx.station.code) return;
  const other = await getStationByCode(ctx.station.networkId, code);
  if (other)
    throw new FileProblem(
      `${ctx.fileName}: the file is from station ${code}, not ${ctx.station.code}; upload it on ${code}'s page`,
      field,
    );
  throw new FileProblem(
    `${ctx.fileName}: unknown station code "${code}" — this network has no such station (add it first, or correct the file)`,
    field,
  );
}

function checkComponent(c: string, ctx: FileContext, field: string): Component {
  if (!COMPONENTS.includes(c as Component))
    throw new FileProblem(`${ctx.fileName}: "${c}" is not a component (Ez, Bns or Bew)`, field);
  if (!ctx.station.components.some((x) => x.component === c)) {
    throw new FileProblem(
      `${ctx.fileName}: station ${ctx.station.code} has no ${c} component installed (add it to the station first)`,
      field,
    );
  }
  return c as Component;
}

function checkRate(rate: number, ctx: FileContext, field: string) {
  if (Math.abs(rate - ctx.station.sampleRateHz) > 1e-9 * rate) {
    throw new FileProblem(
      `${ctx.fileName}: ${field} ${rate} Hz disagrees with station ${ctx.station.code}'s registered ${ctx.station.sampleRateHz} Hz (correct the file or the station)`,
      field,
    );
  }
}

function checkWhen(ms: number, ctx: FileContext, field: string): void {
  const why = outsideSampleWindow(ms);
  if (why) throw new FileProblem(`${ctx.fileName}, ${field}: ${why}`, field);
}

/** The shortest series that gives a spectrum: one Welch segment. */
function checkLongEnough(samples: number, sampleRateHz: number, ctx: FileContext, field: string): void {
  const need = Math.ceil(SIGNAL_SEGMENT_SECONDS * sampleRateHz);
  if (samples < need)
    throw new FileProblem(
      `${ctx.fileName}: ${samples} samples are too short for a spectrum — the minimum is one ${SIGNAL_SEGMENT_SECONDS} s segment, ${need} samples at ${sampleRateHz} Hz`,
      field,
    );
}

async function checkSeriesHeader(h: SeriesHeader, ctx: FileContext): Promise<Partial<Record<Component, number>>> {
  await checkStationCode(h.station, ctx, 'station');
  checkRate(h.sampleRateHz, ctx, 'sample-rate-hz');
  const factors: Partial<Record<Component, number>> = {};
  for (const c of h.components) {
    checkComponent(c, ctx, c);
    const f = sampleUnitFactor(h.units[c] ?? '');
    if (f !== undefined) factors[c] = f;
  }
  return factors;
}

interface JsonUpload {
  component: Component;
  startMs: number;
  sampleRateHz: number;
  samples: number[];
}

async function readJsonUpload(chunks: Chunks, ctx: FileContext): Promise<JsonUpload> {
  const file = ctx.fileName;
  const data = parseJsonText(await textOf(chunks), file) as Record<string, unknown>;
  if (!data || typeof data !== 'object' || Array.isArray(data))
    throw new FileProblem(`${file}: the JSON must be an object`, 'file');
  for (const key of ['station', 'component', 'startUtc'] as const) {
    if (typeof data[key] !== 'string')
      throw new FileProblem(`${file}, field "${key}": an uploaded JSON series needs "${key}" (a string)`, key);
  }
  const series = parseSeriesJson({ segmentSeconds: 10, ...data }, file);
  await checkStationCode(data.station as string, ctx, 'station');
  const component = checkComponent(data.component as string, ctx, 'component');
  const startMs = parseUtc(data.startUtc as string);
  if (startMs === null)
    throw new FileProblem(
      `${file}, field "startUtc": "${data.startUtc}" is not a UTC time like 2026-03-14T00:00:00Z`,
      'startUtc',
    );
  checkRate(series.sampleRateHz, ctx, 'sampleRateHz');
  checkWhen(startMs, ctx, 'startUtc');
  checkLongEnough(series.samples.length, series.sampleRateHz, ctx, 'samples');
  checkWhen(startMs + (series.samples.length / series.sampleRateHz) * 1000, ctx, 'samples');
  return { component, startMs, sampleRateHz: series.sampleRateHz, samples: series.samples };
}

/** Header keys the layout does not know: kept, and listed on the upload as warnings. */
function unknownKeyWarnings(keys: { key: string; line: number }[], ctx: FileContext): string[] {
  return keys.map((k) => `${ctx.fileName}, line ${k.line}: header key "${k.key}" is not part of the layout and was ignored`);
}

/**
 * Reads the whole file once, as the upload arrives; throws FileProblem naming file, line and field.
 * Refuses sample times outside the accepted window and series shorter than one Welch segment.
 */
export async function checkFile(
  format: UploadFormat,
  chunks: Chunks,
  ctx: FileContext,
): Promise<{ intervals: number; warnings: string[] }> {
  try {
    if (format === 'series-csv') {
      const reader = await openSeriesCsv(chunks, ctx.fileName);
      const h = reader.header;
      await checkSeriesHeader(h, ctx);
      checkWhen(h.startMs, ctx, 'start-utc');
      let last = -1;
      let samples = 0;
      for await (const b of reader.blocks) {
        last = b.firstSample + b.length - 1;
        samples += b.length;
      }
      checkLongEnough(samples, h.sampleRateHz, ctx, 'file');
      const spanS = (last + 1) / h.sampleRateHz;
      checkWhen(h.startMs + spanS * 1000, ctx, 'seconds');
      return { intervals: Math.max(1, Math.ceil(spanS / INTERVAL_SECONDS)), warnings: unknownKeyWarnings(h.unknownKeys, ctx) };
    }
    if (format === 'spectra-csv') {
      const f = await readSpectraCsv(chunks, ctx.fileName);
      await checkStationCode(f.station, ctx, 'station');
      checkComponent(f.component, ctx, 'component');
      for (const iv of f.intervals) checkWhen(iv.startMs, ctx, iv.startUtc);
      return { intervals: f.intervals.length, warnings: unknownKeyWarnings(f.unknownKeys, ctx) };
    }
    await readJsonUpload(chunks, ctx);
    return { intervals: 1, warnings: [] };
  } catch (e) {
    return problem(e);
  }
}

/** The file's raw intervals, 10 minutes each aligned to UTC, one component at a time. */
export async function* readUploadIntervals(format: UploadFormat, chunks: Chunks, ctx: FileContext): AsyncGenerator<RawInterval> {
  try {
    if (format === 'series-csv') {
      const reader = await openSeriesCsv(chunks, ctx.fileName);
      const h = reader.header;
      const factors = await checkSeriesHeader(h, ctx);
      const split = splitIntervals(reader.blocks, {
        sampleRateHz: h.sampleRateHz,
        startMs: h.startMs,
        components: h.components.length,
        intervalSeconds: INTERVAL_SECONDS,
      });
      for await (const iv of split) {
        for (let c = 0; c < h.components.length; c++) {
          yield {
            kind: 'samples',
            component: h.components[c],
            startsAt: new Date(iv.startMs),
            durationS: INTERVAL_SECONDS,
            sampleRateHz: h.sampleRateHz,
            samples: iv.columns[c],
            siFactor: factors[h.components[c]],
          };
        }
      }
      return;
    }
    if (format === 'spectra-csv') {
      const f = await readSpectraCsv(chunks, ctx.fileName);
      await checkStationCode(f.station, ctx, 'station');
      const component = checkComponent(f.component, ctx, 'component');
      const siFactor = spectrumUnitFactor(f.units);
      for (const iv of f.intervals) {
        yield {
          kind: 'spectrum',
          component,
          startsAt: new Date(iv.startMs),
          durationS: f.intervalSeconds,
          frequencies: f.frequencies,
          power: iv.power,
          siFactor,
        };
      }
      return;
    }
    const j = await readJsonUpload(chunks, ctx);
    const blocks = (async function* () {
      yield { firstSample: 0, length: j.samples.length, columns: [j.samples] };
    })();
    for await (const iv of splitIntervals(blocks, {
      sampleRateHz: j.sampleRateHz,
      startMs: j.startMs,
      components: 1,
      intervalSeconds: INTERVAL_SECONDS,
    })) {
      yield {
        kind: 'samples',
        component: j.component,
        startsAt: new Date(iv.startMs),
        durationS: INTERVAL_SECONDS,
        sampleRateHz: j.sampleRateHz,
        samples: iv.columns[0],
      };
    }
  } catch (e) {
    problem(e);
  }
}
