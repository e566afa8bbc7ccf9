/**
 * Writer for the Cavitas spectra layout (version 1), the one `readSpectraCsv`
 * reads: header lines, then one row per frequency and one power column per
 * interval, named by the interval's start. Numbers are written in their
 * shortest round-trip form, so reading the file back gives the same values.
 */
import type { Component } from '@/src/engine/components';
import { SPECTRA_FREQUENCY_COLUMN, SPECTRA_SIGNATURE } from './spectra-csv';

export interface SpectraToWrite {
  station: string;
  component: Component;
  units: string;
  intervalSeconds: number;
  frequencies: ArrayLike<number>;
  intervals: { startUtc: string; power: ArrayLike<number> }[];
}

export function writeSpectraCsv(f: SpectraToWrite): string {
  const lines = [
    `# ${SPECTRA_SIGNATURE} 1`,
    `# station: ${f.station}`,
    `# component: ${f.component}`,
    `# units: ${f.units}`,
    `# interval-seconds: ${f.intervalSeconds}`,
    [SPECTRA_FREQUENCY_COLUMN, ...f.intervals.map((i) => i.startUtc)].join(','),
  ];
  for (let k = 0; k < f.frequencies.length; k++)
    lines.push([f.frequencies[k], ...f.intervals.map((i) => i.power[k])].map((v) => String(v)).join(','));
  return `${lines.join('\n')}\n`;
}
