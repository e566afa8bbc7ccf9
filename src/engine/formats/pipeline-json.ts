/**
 * JSON documents of the pipeline commands: a series
 * `{ sampleRateHz, samples, segmentSeconds, mainsHz? }` and a spectrum
 * `{ frequencies, power }` (optionally `averages`, `minHz`, `maxHz`). Other
 * fields are allowed. Errors name the file and the field (with its index).
 */
import { z } from 'zod';
import { welchStatisticsSchema } from '@/src/engine/case/schema';
import { FormatError } from './format-error';

const finite = z.number().refine(Number.isFinite, 'must be a finite number');

export const seriesJsonSchema = z.looseObject({
  sampleRateHz: z.number().positive().refine(Number.isFinite, 'must be finite'),
  samples: z.array(finite).min(2),
  segmentSeconds: z.number().positive().refine(Number.isFinite, 'must be finite'),
  mainsHz: z.number().positive().optional(),
});
export type SeriesJson = z.infer<typeof seriesJsonSchema>;

export const spectrumJsonSchema = z.looseObject({
  frequencies: z.array(finite.refine((v) => v >= 0, 'must be >= 0')).min(2),
  power: z.array(finite.refine((v) => v >= 0, 'must be >= 0')).min(2),
  averages: z.number().positive().optional(),
  /** Welch statistics as `spectrum` reports them; their K_eff and Hann bin correlation set the fit's errors. */
  welch: welchStatisticsSchema.optional(),
  minHz: z.number().nonnegative().optional(),
  maxHz: z.number().positive().optional(),
});
export type SpectrumJson = z.infer<typeof spectrumJsonSchema>;

function fromZod(file: string, error: z.ZodError): FormatError {
  const issue = error.issues[0];
  const field = issue.path.length
    ? issue.path.map((p, i) => (typeof p === 'number' ? `[${p}]` : (i ? '.' : '') + String(p))).join('')
    : '(top level)';
  return new FormatError(file, null, field, issue.message);
}

/** Validate a parsed series document; the segment must be a whole number of at least 2 samples and fit in the data. */
export function parseSeriesJson(data: unknown, file: string): SeriesJson & { segmentLength: number } {
  const r = seriesJsonSchema.safeParse(data);
  if (!r.success) throw fromZod(file, r.error);
  const s = r.data;
  const exact = s.sampleRateHz * s.segmentSeconds;
  const segmentLength = Math.round(exact);
  if (Math.abs(exact - segmentLength) > 1e-9 * exact || segmentLength < 2) {
    throw new FormatError(
      file,
      null,
      'segmentSeconds',
      `${s.segmentSeconds} s at ${s.sampleRateHz} Hz is not a whole number (>= 2) of samples`,
    );
  }
  if (s.samples.length < segmentLength) {
    throw new FormatError(
      file,
      null,
      'samples',
      `${s.samples.length} samples are fewer than one ${s.segmentSeconds} s segment (${segmentLength} samples)`,
    );
  }
  return { ...s, segmentLength };
}

/** Validate a parsed spectrum document: equal lengths and increasing frequencies. */
export function parseSpectrumJson(data: unknown, file: string): SpectrumJson {
  const r = spectrumJsonSchema.safeParse(data);
  if (!r.success) throw fromZod(file, r.error);
  const s = r.data;
  if (s.power.length !== s.frequencies.length) {
    throw new FormatError(file, null, 'power', `has ${s.power.length} values but frequencies has ${s.frequencies.length}`);
  }
  for (let i = 1; i < s.frequencies.length; i++) {
    if (!(s.frequencies[i] > s.frequencies[i - 1]))
      throw new FormatError(
        file,
        null,
        `frequencies[${i}]`,
        `${s.frequencies[i]} does not increase on the previous value ${s.frequencies[i - 1]}`,
      );
  }
  return s;
}
