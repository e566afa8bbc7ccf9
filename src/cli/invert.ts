/**
 * `invert <case.json> [--starts N] [--seed S] [--threads T]`: multi-start
 * inversion of the observed spectra (`observed`) or of observed mode
 * parameters (`observedModes`, src/engine/case/mode-input.ts) for the unknown regions.
 * Prints the distinct minima best first; progress goes to stderr. The case's own `starts`,
 * `seed` and `solver` settings apply unless a flag says otherwise.
 */
import { availableParallelism } from 'node:os';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { intervalInputFromCase } from '@/src/engine/case/interval-input';
import { invertAnyCaseSchema } from '@/src/engine/case/mode-input';
import { caseSolveSchema, solveOptionsFromCase } from '@/src/engine/case/solve-options';
import { INVERSION_DEFAULTS } from '@/src/engine/inverse/defaults';
import { invertInterval } from '@/src/engine/inverse/invert';
import { closeInversionPool } from '@/src/engine/inverse/threads/pool';
import { OptimInputError } from '@/src/engine/optim/errors';
import { CliError, intFlag, parseArgs, readJsonFile, type Verb } from './verb';

const invert: Verb = async (args) => {
  const { positional, flags } = parseArgs(args, ['starts', 'seed', 'threads']);
  const file = positional[0];
  const c = await readJsonFile(file, invertAnyCaseSchema, 'case');
  // The case's own starts, seed and solver settings (a run exported as a case carries them); flags win.
  const asked = solveOptionsFromCase(caseSolveSchema.parse(c));
  const starts = intFlag(flags, 'starts', asked.starts ?? INVERSION_DEFAULTS.starts, 1, 100_000);
  const seed = intFlag(flags, 'seed', asked.seed ?? INVERSION_DEFAULTS.seed, 0, 2 ** 31 - 1);
  const threads = intFlag(flags, 'threads', availableParallelism(), 1, 256);
  let lastPct = -1;
  try {
    const callbacks = {
      onProgress: ({ done, total, bestMisfit }: { done: number; total: number; bestMisfit: number }) => {
        const pct = Math.floor((100 * done) / total);
        if (pct >= lastPct + 10 || done === total) {
          lastPct = pct;
          process.stderr.write(`invert: ${done}/${total} starts, best misfit ${bestMisfit.toPrecision(6)}\n`);
        }
      },
    };
    const result = await invertInterval(intervalInputFromCase(c), { ...asked, starts, seed, threads }, callbacks);
    return {
      ...result,
      minima: result.minima.map((m) => ({
        misfit: m.misfit,
        count: m.count,
        sources: m.sources,
        stdErrors: m.stdErrors,
        correlation: m.correlation,
        reducedChi2: m.reducedChi2,
        params: m.params,
        resolution: m.resolution,
        singular: m.singular,
        rank: m.rank,
        stopReasons: m.stopReasons,
        startIndexes: m.startIndexes,
      })),
    };
  } catch (e) {
    if (e instanceof InversionInputError || e instanceof OptimInputError) throw new CliError(`${file}: ${e.message}`);
    throw e;
  } finally {
    await closeInversionPool();
  }
};

export default invert;
