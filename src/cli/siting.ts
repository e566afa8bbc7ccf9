/**
 * `siting <case.json> --candidates <sites.json>`: the unknowns' standard errors
 * linearised at the case's `sources` (Fisher information over the band with the
 * case's `noise`, no inversion run), for the network as it is and with each
 * candidate station added (src/engine/studies/siting.ts).
 */
import { studyFromCase } from '@/src/engine/case/study-input';
import { candidatesSchema, studyCaseSchema } from '@/src/engine/case/study-schema';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { sitingStudy } from '@/src/engine/studies/siting';
import { CliError, parseArgs, readJsonFile, type Verb } from './verb';

const siting: Verb = async (args) => {
  const { positional, flags } = parseArgs(args, ['candidates']);
  if (positional.length > 1) throw new CliError(`siting takes one case file, got ${positional.length} arguments`);
  if (flags.candidates === undefined) throw new CliError('--candidates <sites.json> is required');
  const c = await readJsonFile(positional[0], studyCaseSchema, 'case');
  const candidates = await readJsonFile(flags.candidates, candidatesSchema, 'candidates');
  try {
    return sitingStudy(studyFromCase(c), candidates);
  } catch (e) {
    if (e instanceof InversionInputError || e instanceof RangeError) throw new CliError(`${positional[0]}: ${e.message}`);
    throw e;
  }
};

export default siting;
