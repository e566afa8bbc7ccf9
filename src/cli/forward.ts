/**
 * `cli forward <case.json>`: predicted spectra of the case's point (or spot) sources at
 * its stations, one entry per station and component in input order, SI units.
 */
import { forwardCaseSchema } from '@/src/engine/case/schema';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { predictSpectra } from '@/src/engine/forward/predict';
import { CliError, parseArgs, readJsonFile, type Verb } from './verb';

const forward: Verb = async (args) => {
  const { positional } = parseArgs(args, []);
  if (positional.length > 1) throw new CliError(`forward takes one case file, got ${positional.length} arguments`);
  const c = await readJsonFile(positional[0], forwardCaseSchema, 'case');
  let cavity;
  try {
    cavity = resolveCavity(c.cavity);
  } catch (e) {
    throw new CliError((e as Error).message);
  }
  const spectra = predictSpectra({ cavity, band: c.band, stations: c.stations, sources: c.sources ?? [] });
  return { spectra };
};

export default forward;
