/**
 * Streaming splitter: contiguous blocks of samples in, whole processing
 * intervals out. Intervals are aligned to UTC (00:00, 00:10, ... for 600 s);
 * samples missing inside an interval (gaps, or the part before a record
 * starts or after it ends) are NaN, which the processing counts as gaps.
 * Holds one interval per component at a time, whatever the record's length.
 */
import { SIGNAL_INTERVAL_SECONDS } from '@/src/engine/tolerances';

export interface SplitterOptions {
  sampleRateHz: number;
  /** UTC time of sample 0, in ms since 1970. */
  startMs: number;
  /** Number of component columns per block. */
  components: number;
  intervalSeconds?: number;
}

export interface SampleBlock {
  firstSample: number;
  length: number;
  columns: ArrayLike<number>[];
}

export interface IntervalSamples {
  /** UTC start of the interval, ms since 1970 (a multiple of the interval length). */
  startMs: number;
  /** One array per component, intervalSeconds * sampleRateHz long. */
  columns: Float64Array[];
  /** Samples of the interval that no block supplied. */
  missing: number;
}

export class IntervalSplitter {
  readonly intervalSamples: number;
  private readonly fs: number;
  private readonly intervalMs: number;
  private current: IntervalSamples | null = null;
  private currentIndex = -Infinity;
  private lastSample = -1;

  constructor(private readonly options: SplitterOptions) {
    const fs = options.sampleRateHz;
    const seconds = options.intervalSeconds ?? SIGNAL_INTERVAL_SECONDS;
    const exact = seconds * fs;
    if (!(fs > 0) || !(seconds > 0) || Math.abs(exact - Math.round(exact)) > 1e-9 * exact) {
      throw new RangeError(`an interval of ${seconds} s at ${fs} Hz is not a whole number of samples`);
    }
    if (!Number.isInteger(options.components) || options.components < 1)
      throw new RangeError(`components must be a positive whole number, got ${options.components}`);
    this.fs = fs;
    this.intervalSamples = Math.round(exact);
    this.intervalMs = seconds * 1000;
  }

  /** Interval number (since 1970) holding a sample. */
  private intervalOf(sample: number): number {
    return Math.floor((this.options.startMs + (sample * 1000) / this.fs) / this.intervalMs + 1e-12);
  }

  /** First sample (of the record) at or after the start of interval k. */
  private firstSampleOf(k: number): number {
    return Math.ceil(((k * this.intervalMs - this.options.startMs) * this.fs) / 1000 - 1e-9);
  }

  private open(k: number): void {
    const columns = Array.from({ length: this.options.components }, () => new Float64Array(this.intervalSamples).fill(NaN));
    this.current = { startMs: k * this.intervalMs, columns, missing: this.intervalSamples };
    this.currentIndex = k;
  }

  /** Feed one block (blocks must move forward in time); returns the intervals it completed. */
  push(block: SampleBlock): IntervalSamples[] {
    if (block.columns.length !== this.options.components)
      throw new RangeError(`block has ${block.columns.length} columns, expected ${this.options.components}`);
    if (block.length > 0 && block.firstSample <= this.lastSample)
      throw new RangeError(`block starting at sample ${block.firstSample} overlaps earlier samples (up to ${this.lastSample})`);
    const done: IntervalSamples[] = [];
    let s = block.firstSample;
    const end = block.firstSample + block.length;
    while (s < end) {
      let k = this.intervalOf(s);
      while (this.firstSampleOf(k + 1) <= s) k++;
      while (this.firstSampleOf(k) > s) k--;
      if (k !== this.currentIndex) {
        if (this.current) done.push(this.current);
        this.open(k);
      }
      const i0 = this.firstSampleOf(k);
      const stop = Math.min(end, i0 + this.intervalSamples);
      const cur = this.current!;
      for (let c = 0; c < block.columns.length; c++) {
        const src = block.columns[c];
        const dst = cur.columns[c];
        for (let j = s; j < stop; j++) dst[j - i0] = src[j - block.firstSample];
      }
      cur.missing -= stop - s;
      s = stop;
    }
    if (block.length > 0) this.lastSample = end - 1;
    return done;
  }

  /** The last, possibly partial, interval. */
  finish(): IntervalSamples[] {
    const out = this.current ? [this.current] : [];
    this.current = null;
    return out;
  }
}

/** Convenience: split an async stream of blocks into intervals. */
export async function* splitIntervals(
  blocks: AsyncIterable<SampleBlock>,
  options: SplitterOptions,
): AsyncGenerator<IntervalSamples> {
  const splitter = new IntervalSplitter(options);
  for await (const b of blocks) yield* splitter.push(b);
  yield* splitter.finish();
}
