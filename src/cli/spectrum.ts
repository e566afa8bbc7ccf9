/**
 * `cli spectrum <series.json>`: one-sided Welch PSD (Hann window, 50 % overlap,
 * mean removed per segment, density scaling) of `samples`; with `mainsHz` the
 * mains line and its harmonics up to the Nyquist frequency are bridged over.
 * The output adds `welch`: segments averaged, window, overlap and K_eff.
 */
import { parseSeriesJson } from '@/src/engine/formats/pipeline-json';
import { mainsLines, suppressLines } from '@/src/engine/signal/line-suppression';
import { welch, welchStatisticsOf } from '@/src/engine/signal/welch';
import { readPipelineJson } from './pipeline-input';
import { CliError, parseArgs, type Verb } from './verb';

const spectrum: Verb = async (args) => {
  const { positional } = parseArgs(args, []);
  if (positional.length > 1) throw new CliError(`spectrum takes one series file, got ${positional.length} arguments`);
  const s = await readPipelineJson(positional[0], 'series', parseSeriesJson);
  const est = welch(s.samples, { sampleRateHz: s.sampleRateHz, segmentLength: s.segmentLength });
  let power = est.power;
  if (s.mainsHz !== undefined) {
    if (s.mainsHz >= s.sampleRateHz / 2)
      throw new CliError(
        `${positional[0]}: field "mainsHz": ${s.mainsHz} Hz is at or above the Nyquist frequency ${s.sampleRateHz / 2} Hz`,
      );
    power = suppressLines(est.frequencies, est.power, mainsLines(s.mainsHz, s.sampleRateHz / 2)).power;
  }
  if (est.used === 0) throw new CliError(`${positional[0]}: no segment could be averaged (non-finite samples)`);
  return {
    frequencies: Array.from(est.frequencies),
    power: Array.from(power),
    segments: est.used,
    welch: welchStatisticsOf(est),
  };
};

export default spectrum;
