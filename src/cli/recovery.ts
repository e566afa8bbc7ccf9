/**
 * `recovery <case.json> --realisations N --seed S [--starts N] [--threads T]`:
 * synthetic spectra from the case's `sources` (the truth) with fresh seeded
 * noise per realisation (the case's `noise`), each inverted like a real run;
 * prints how every free parameter came back (src/engine/studies/recovery.ts).
 * The case's own `starts`, `seed` (of the start sequence) and `solver`
 * settings apply to each inversion unless a flag says otherwise.
 */
import { availableParallelism } from 'node:os';
import { solveOptionsFromCase, caseSolveSchema } from '@/src/engine/case/solve-options';
import { studyFromCase } from '@/src/engine/case/study-input';
import { studyCaseSchema } from '@/src/engine/case/study-schema';
import { INVERSION_DEFAULTS } from '@/src/engine/inverse/defaults';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { closeInversionPool } from '@/src/engine/inverse/threads/pool';
import { OptimInputError } from '@/src/engine/optim/errors';
import { recoveryStudy } from '@/src/engine/studies/recovery';
import { RECOVERY_MAX_REALISATIONS } from '@/src/engine/studies/recovery-options';
import { CliError, intFlag, parseArgs, readJsonFile, type Verb } from './verb';

const recovery: Verb = async (args) => {
  const { positional, flags } = parseArgs(args, ['realisations', 'seed', 'starts', 'threads']);
  if (positional.length > 1) throw new CliError(`recovery takes one case file, got ${positional.length} arguments`);
  if (flags.realisations === undefined) throw new CliError('--realisations N is required (how many noise realisations)');
  const realisations = intFlag(flags, 'realisations', 0, 1, RECOVERY_MAX_REALISATIONS);
  const seed = intFlag(flags, 'seed', INVERSION_DEFAULTS.seed, 0, 2 ** 31 - 1);
  const c = await readJsonFile(positional[0], studyCaseSchema, 'case');
  const asked = solveOptionsFromCase(caseSolveSchema.parse(c));
  const starts = intFlag(flags, 'starts', asked.starts ?? INVERSION_DEFAULTS.starts, 1, 100_000);
  const threads = intFlag(flags, 'threads', availableParallelism(), 1, 256);
  let lastPct = -1;
  try {
    return await recoveryStudy(
      studyFromCase(c),
      { realisations, seed, inversion: { ...asked, starts, threads } },
      {
        onProgress: ({ done, total }) => {
          const pct = Math.floor((100 * done) / total);
          if (pct >= lastPct + 10 || done === total) {
            lastPct = pct;
            process.stderr.write(`recovery: ${done}/${total} realisations\n`);
          }
        },
      },
    );
  } catch (e) {
    if (e instanceof InversionInputError || e instanceof OptimInputError || e instanceof RangeError)
      throw new CliError(`${positional[0]}: ${e.message}`);
    throw e;
  } finally {
    await closeInversionPool();
  }
};

export default recovery;
