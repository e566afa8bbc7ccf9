/**
 * Mode parameters in a case file, for `invert`: a top-level `observedModes`
 * list instead of `observed` spectra. Each entry is one station and component
 * with its fitted modes (frequency Hz, peak intensity in the component's SI
 * power-density unit, half-width Hz, and the standard deviations of
 * frequency, ln intensity and half-width) and, optionally, the fit they came
 * from (`fit: { modes, minHz?, maxHz?, excludeLines?: [{ frequencyHz,
 * halfWidthHz }], excludeRanges?: [{ minHz, maxHz }] }`, the ranges as a stored
 * fit records them; the predicted modes go through the same fit). The case's `band` is the grid of the predicted spectra; it must
 * cover the fitted band in the bins the observed spectrum had.
 */
import { z } from 'zod';
import { modeWhitener } from '@/src/engine/inverse/mode-whitening';
import { caseSchema, type CaseFile } from './schema';
import type { CavityConfig } from '@/src/engine/cavity';
import { COMPONENTS, type Component } from '@/src/engine/components';
import { MAX_MODES, MIN_MODES } from '@/src/engine/modes/usual-modes';
import { unknownsFromCase } from './spectrum-input';
import { caseSolveSchema } from './solve-options';
import type { ModeInversionInput } from '@/src/engine/inverse/interval-problem';

const positive = z.number().positive();

export const observedModeSchema = z.looseObject({
  frequency: positive,
  intensity: positive,
  halfWidth: positive,
  sigmaFrequency: positive,
  sigmaLogIntensity: positive,
  sigmaHalfWidth: positive,
  /** Correlation (3x3) of frequency, ln intensity and half-width, as `fit` reports it; the misfit then whitens the mode. */
  correlation: z
    .array(z.array(z.number().min(-1).max(1)).length(3))
    .length(3)
    .superRefine((r, ctx) => {
      const problem = modeWhitener(r);
      if (typeof problem === 'string') ctx.addIssue({ code: 'custom', message: `the correlation ${problem}` });
    })
    .optional(),
});

export const observedModesSchema = z.looseObject({
  station: z.string().min(1),
  component: z.enum(COMPONENTS),
  modes: z.array(observedModeSchema).min(1),
  fit: z
    .looseObject({
      modes: z.number().int().min(MIN_MODES).max(MAX_MODES),
      minHz: positive.optional(),
      maxHz: positive.optional(),
      excludeLines: z.array(z.looseObject({ frequencyHz: positive, halfWidthHz: positive })).optional(),
      excludeRanges: z
        .array(
          z
            .looseObject({ minHz: positive, maxHz: positive })
            .refine((r) => r.minHz <= r.maxHz, { message: 'the range must not end below its start', path: ['maxHz'] }),
        )
        .optional(),
    })
    .optional(),
});

export type CaseModes = z.infer<typeof observedModesSchema>;

/**
 * A case for `invert` with either observed spectra or observed modes (exactly one of the two), and unknowns;
 * its optional `starts`, `seed` and `solver` are checked too (solve-options.ts).
 */
export const invertAnyCaseSchema = caseSchema.superRefine((c, ctx) => {
  const solve = caseSolveSchema.safeParse(c);
  if (!solve.success)
    for (const issue of solve.error.issues)
      ctx.addIssue({
        code: 'custom',
        path: issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p)),
        message: issue.message,
      });
  const raw = (c as { observedModes?: unknown }).observedModes;
  const hasSpectra = (c.observed?.length ?? 0) > 0;
  if (raw !== undefined && hasSpectra)
    ctx.addIssue({ code: 'custom', path: ['observedModes'], message: 'give either observed spectra or observedModes, not both' });
  if (raw === undefined && !hasSpectra)
    ctx.addIssue({
      code: 'custom',
      path: ['observed'],
      message: 'invert needs at least one observed spectrum (or observedModes)',
    });
  if (!c.unknowns || c.unknowns.length === 0)
    ctx.addIssue({ code: 'custom', path: ['unknowns'], message: 'invert needs at least one unknown source' });
  if (raw === undefined) return;
  const parsed = z.array(observedModesSchema).min(1).safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues)
      ctx.addIssue({
        code: 'custom',
        path: ['observedModes', ...issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p))],
        message: issue.message,
      });
    return;
  }
  const comps = new Map(c.stations.map((s) => [s.code, new Set(s.components)]));
  parsed.data.forEach((o, i) => {
    const mine = comps.get(o.station);
    if (!mine)
      ctx.addIssue({ code: 'custom', path: ['observedModes', i, 'station'], message: `no station with code "${o.station}"` });
    else if (!mine.has(o.component))
      ctx.addIssue({
        code: 'custom',
        path: ['observedModes', i, 'component'],
        message: `station "${o.station}" does not list component ${o.component}`,
      });
  });
});

/** The case's observed modes, or undefined when the case has spectra. */
export function caseModes(c: CaseFile): CaseModes[] | undefined {
  return (c as { observedModes?: CaseModes[] }).observedModes;
}

/** From a validated case with observedModes to the mode inversion's input. */
export function modeInputFromCase(c: CaseFile): ModeInversionInput {
  const modes = caseModes(c) ?? [];
  return {
    cavity: c.cavity as CavityConfig,
    band: { minHz: c.band.minHz, maxHz: c.band.maxHz, stepHz: c.band.stepHz },
    stations: c.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon })),
    modes: modes.map((o) => ({
      station: o.station,
      component: o.component as Component,
      modes: o.modes.map((m) => ({
        frequency: m.frequency,
        intensity: m.intensity,
        halfWidth: m.halfWidth,
        sigmaFrequency: m.sigmaFrequency,
        sigmaLogIntensity: m.sigmaLogIntensity,
        sigmaHalfWidth: m.sigmaHalfWidth,
        ...(m.correlation ? { correlation: m.correlation.map((row) => [...row]) } : {}),
      })),
      ...(o.fit
        ? {
            fit: {
              modes: o.fit.modes,
              minHz: o.fit.minHz,
              maxHz: o.fit.maxHz,
              excludeLines: o.fit.excludeLines?.map((l) => ({ frequencyHz: l.frequencyHz, halfWidthHz: l.halfWidthHz })),
              excludeRanges: o.fit.excludeRanges?.map((r) => ({ minHz: r.minHz, maxHz: r.maxHz })),
            },
          }
        : {}),
    })),
    unknowns: unknownsFromCase(c),
  };
}
