/**
 * From a series reader to processed intervals: the whole path the worker
 * runs for an uploaded station file, one interval and component at a time.
 * Memory stays bounded by one interval per component.
 */
import type { Component } from '@/src/engine/components';
import type { SeriesReader } from '@/src/engine/formats/series-csv';
import { splitIntervals } from './interval-splitter';
import { processInterval } from './process-interval';
import type { IntervalResult, ProcessingConfig } from './types';

export interface ProcessedInterval {
  startMs: number;
  component: Component;
  /** Samples missing from the interval (gaps or the record's ends). */
  missing: number;
  result: IntervalResult;
}

export async function* processSeries(
  reader: SeriesReader,
  configFor: (component: Component) => Omit<ProcessingConfig, 'sampleRateHz'>,
  options: { intervalSeconds?: number; shouldStop?: () => boolean } = {},
): AsyncGenerator<ProcessedInterval> {
  const { header } = reader;
  const splitterOptions = {
    sampleRateHz: header.sampleRateHz,
    startMs: header.startMs,
    components: header.components.length,
    intervalSeconds: options.intervalSeconds,
  };
  for await (const interval of splitIntervals(reader.blocks, splitterOptions)) {
    for (let c = 0; c < header.components.length; c++) {
      if (options.shouldStop?.()) return;
      const component = header.components[c];
      const result = processInterval(interval.columns[c], { ...configFor(component), sampleRateHz: header.sampleRateHz });
      yield { startMs: interval.startMs, component, missing: interval.missing, result };
    }
  }
}
