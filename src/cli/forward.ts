/**
 * `cli forward <case.json>`: predicted spectra of the case's point, spot or grid-cell sources at
 * its stations, one entry per station and component in input order, SI units.
 */
import { forwardCaseSchema } from '@/src/engine/case/schema';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { predictSpectra } from '@/src/engine/forward/predict';
import { forwardSources } from '@/src/engine/case/sources';
import { CliError, parseArgs, readJsonFile, type Verb } from './verb';

const forward: Verb = async (args) => {
  const { positional } = parseArgs(args, []);
  if (positional.length > 1) throw new CliError(`forward takes one case file, got ${positional.length} arguments`);
  const c = await readJsonFile(positional[0], forwardCaseSchema, 'case');
  try {
    const cavity = resolveCavity(c.cavity);
    const spectra = predictSpectra({ cavity, band: c.band, stations: c.stations, sources: forwardSources(c.sources ?? []) });
    return { spectra };
  } catch (e) {
    // the engine reports impossible physics (e.g. a lossless table on a resonance) as RangeError
    if (e instanceof RangeError) throw new CliError(`${positional[0]}: ${e.message}`);
    throw e;
  }
};

export default forward;
