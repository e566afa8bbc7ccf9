/**
 * How a case asks to be solved, beside what it holds: optional top-level
 * `starts`, `seed` and `solver: { initialDamping, maxIterations, scaleErrors }`.
 * A run exported as a case carries its own, so that `invert` without flags
 * solves it as the run did; `--starts` and `--seed` on the command line win.
 */
import { z } from 'zod';
import type { MultiStartOptions } from '@/src/engine/inverse/multistart-options';

export const caseSolveSchema = z.looseObject({
  starts: z.number().int().min(1).max(100_000).optional(),
  seed: z
    .number()
    .int()
    .min(0)
    .max(2 ** 31 - 1)
    .optional(),
  solver: z
    .looseObject({
      /** Initial Levenberg–Marquardt damping, relative to the largest diagonal of J^T J. */
      initialDamping: z.number().positive().max(1e6).optional(),
      maxIterations: z.number().int().min(1).max(100_000).optional(),
      /** Scale standard errors by the reduced chi-square. */
      scaleErrors: z.boolean().optional(),
    })
    .optional(),
});
export type CaseSolve = z.infer<typeof caseSolveSchema>;

/** The multi-start options a case asks for (only what it gives; the inverter's defaults fill the rest). */
export function solveOptionsFromCase(c: CaseSolve): Partial<MultiStartOptions> {
  const s = c.solver ?? {};
  const lm = {
    ...(s.initialDamping !== undefined ? { initialDamping: s.initialDamping } : {}),
    ...(s.maxIterations !== undefined ? { maxIterations: s.maxIterations } : {}),
  };
  return {
    ...(c.starts !== undefined ? { starts: c.starts } : {}),
    ...(c.seed !== undefined ? { seed: c.seed } : {}),
    ...(Object.keys(lm).length ? { lm } : {}),
    ...(s.scaleErrors !== undefined ? { scaleErrors: s.scaleErrors } : {}),
  };
}
