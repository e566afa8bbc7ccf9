/**
 * The run configuration: what a launch asks for, validated once with zod and
 * stored whole on the run record. Shared by the launcher form, the API, the
 * worker and the run page.
 */
import { z } from 'zod';
import { COMPONENTS } from '@/src/engine/components';
import { INVERSION_DEFAULTS } from '@/src/engine/inverse/defaults';
import type { ObservedModes } from '@/src/engine/inverse/types';
import type { ObservedSeries } from './types';

const bounds = z
  .object({ min: z.number(), max: z.number() })
  .refine((b) => b.min < b.max, { message: 'the lower bound must be below the upper bound' });

export const regionUnknownSchema = z.object({
  region: z.string().min(1),
  intensity: bounds.refine((b) => b.min > 0, { message: 'the lowest intensity must be above 0 C^2 km^2/s' }),
  /** Moving regions only: the range their centre may take (inside the region's own bounds). */
  lat: bounds.optional(),
  lon: bounds.optional(),
});
export type RegionUnknown = z.infer<typeof regionUnknownSchema>;

export const runConfigSchema = z.object({
  name: z.string().trim().min(1, 'give the run a name').max(120),
  modelId: z.uuid('choose a cavity model'),
  gridId: z.uuid('choose a source grid'),
  data: z
    .object({
      stationIds: z.array(z.uuid()).min(1, 'choose at least one station'),
      components: z.array(z.enum(COMPONENTS)).min(1, 'choose at least one component'),
      from: z.iso.datetime({ offset: true }),
      to: z.iso.datetime({ offset: true }),
      includeFlagged: z.boolean().default(false),
    })
    .refine((d) => Date.parse(d.from) <= Date.parse(d.to), { message: 'the range ends before it starts', path: ['to'] }),
  observables: z.discriminatedUnion('kind', [
    z
      .object({
        kind: z.literal('spectrum'),
        minHz: z.number().positive(),
        maxHz: z.number().positive(),
        every: z.number().int().min(1).max(20).default(1),
      })
      .refine((o) => o.minHz < o.maxHz, { message: 'the band must have its lower edge below its upper edge', path: ['maxHz'] }),
    z.object({ kind: z.literal('modes'), modes: z.number().int().min(1).max(7) }),
  ]),
  regions: z.array(regionUnknownSchema).min(1, 'choose at least one source region'),
  damping: z
    .object({
      initialLambda: z.number().positive().max(1e6).default(INVERSION_DEFAULTS.lm.initialDamping),
      maxIterations: z.number().int().min(5).max(2000).default(INVERSION_DEFAULTS.lm.maxIterations),
      /**
       * Runs launched before `scaleErrorsByMisfit`: true stored errors multiplied by sqrt(reduced chi2)
       * (also below 1). Read only to undo that and as the switch's value for those runs
       * (src/runs/error-scaling.ts); new runs set `scaleErrorsByMisfit`.
       */
      scaleCovariance: z.boolean().optional(),
    })
    .default({
      initialLambda: INVERSION_DEFAULTS.lm.initialDamping,
      maxIterations: INVERSION_DEFAULTS.lm.maxIterations,
    }),
  /**
   * "Scale errors by the misfit": shown errors times sqrt(chi2 / dof) of their minimum where that is above 1.
   * Off by default: errors then follow from the stated sigmas alone. Recorded with the run.
   */
  scaleErrorsByMisfit: z.boolean().optional(),
  starts: z.number().int().min(1).max(256).default(INVERSION_DEFAULTS.seriesStarts),
  seed: z
    .number()
    .int()
    .min(0)
    .max(2 ** 31 - 1)
    .default(1),
  /**
   * A run made from an imported case file: the case's own observations, solved instead of stored
   * spectra (validated by the engine's case schema on import; see src/runs/case-import.ts).
   */
  imported: z
    .object({
      observed: z.array(z.custom<ObservedSeries>()),
      modes: z.array(z.custom<ObservedModes>()).optional(),
    })
    .optional(),
});
export type RunConfig = z.infer<typeof runConfigSchema>;
export type RunConfigInput = z.input<typeof runConfigSchema>;

/** Whether a run's shown errors are scaled by its misfit (runs launched before the switch: their old setting). */
export function scalesErrorsByMisfit(config: Pick<RunConfig, 'scaleErrorsByMisfit' | 'damping'>): boolean {
  return config.scaleErrorsByMisfit ?? config.damping.scaleCovariance ?? false;
}

/** Number of free parameters a configuration asks for: intensity, plus lat/lon for moving regions. */
export function countParameters(config: Pick<RunConfig, 'regions'>): number {
  return config.regions.reduce((n, r) => n + 1 + (r.lat ? 1 : 0) + (r.lon ? 1 : 0), 0);
}

/** The 10-minute interval starts (ISO, UTC) between `from` and `to`, inclusive, aligned to 10 minutes. */
export function intervalStartsBetween(fromIso: string, toIso: string, stepS = 600): string[] {
  const step = stepS * 1000;
  const from = Math.ceil(Date.parse(fromIso) / step) * step;
  const to = Date.parse(toIso);
  const out: string[] = [];
  for (let t = from; t <= to; t += step) out.push(new Date(t).toISOString());
  return out;
}
