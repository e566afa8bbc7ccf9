/**
 * `cli fit <spectrum.json> [--modes N]`: Lorentzian mode fit
 * P(f) = sum A_n / (1 + ((f - f_n)/g_n)^2) + b0 + b1 f of a power spectrum,
 * modes sorted by frequency, with errors propagated from the bins' scatter
 * through the fit (modes/fit-errors.ts). Optional input fields: `averages`
 * (equivalent independent averages behind each bin, for overlapping Welch
 * segments fewer than the segments: absolute errors, bins taken as
 * independent; without it the scatter is estimated from the misfit),
 * `minHz`, `maxHz` (fitted band), `welch` (the statistics `spectrum` reports; they win over
 * `averages`: K_eff and the Hann bin correlation). Per mode the output adds `peak` (amplitude plus
 * background), `errors.lnPeak` and the 3x3 `correlation` of (frequency, ln peak, halfWidth).
 * The output names the band and the averages used.
 */
import { parseSpectrumJson } from '@/src/engine/formats/pipeline-json';
import { fitModes, ModeFitError } from '@/src/engine/modes/fit-modes';
import { ModeFitOptionError } from '@/src/engine/modes/options';
import { MAX_MODES, MIN_MODES } from '@/src/engine/modes/usual-modes';
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';
import { readPipelineJson } from './pipeline-input';
import { CliError, parseArgs, type Verb } from './verb';

const fit: Verb = async (args) => {
  const { positional, flags } = parseArgs(args, ['modes']);
  if (positional.length > 1) throw new CliError(`fit takes one spectrum file, got ${positional.length} arguments`);
  let modes: number | undefined;
  if (flags.modes !== undefined) {
    modes = Number(flags.modes);
    if (!Number.isInteger(modes) || modes < MIN_MODES || modes > MAX_MODES) {
      throw new CliError(`--modes must be a whole number from ${MIN_MODES} to ${MAX_MODES}, got "${flags.modes}"`);
    }
  }
  const s = await readPipelineJson(positional[0], 'spectrum', parseSpectrumJson);
  try {
    // Welch statistics win over a bare `averages`: K_eff and the Hann bin correlation of the segments averaged
    const w = s.welch;
    const r = fitModes(s.frequencies, s.power, {
      modes,
      averages: w ? w.effectiveAverages : s.averages,
      binCorrelation: w ? hannWelchBinCorrelation(w.segments, w.overlap) : undefined,
      minHz: s.minHz,
      maxHz: s.maxHz,
    });
    return {
      modes: r.modes,
      background: r.background,
      misfit: r.misfit,
      dof: r.dof,
      band: r.band,
      averages: r.averages ?? null,
      converged: r.converged,
      flags: r.flags,
    };
  } catch (e) {
    if (e instanceof ModeFitError || e instanceof ModeFitOptionError) throw new CliError(`${positional[0]}: ${e.message}`);
    throw e;
  }
};

export default fit;
