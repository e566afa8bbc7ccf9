/**
 * The case file of the two studies, `siting` and `recovery`: an `invert` case
 * whose `sources` are the solution to linearise at (siting) or the truth to
 * recover (recovery), whose `unknowns` say what is solved for, and a top-level
 * `noise` that applies to every station series on the band — the standard
 * deviation of ln power, `{ sigmaLog }`, or the Welch statistics of the
 * spectra, `{ welch }` (which then carry the log bias and bin correlation).
 * `observed` is not needed. Also the candidate sites of `siting`.
 */
import { z } from 'zod';
import { COMPONENTS } from '../components';
import { caseSchema, welchStatisticsSchema } from './schema';

export const noiseSchema = z
  .looseObject({
    /** Standard deviation of ln(power) of every bin. */
    sigmaLog: z.number().positive('sigmaLog must be above 0: noise of zero or less makes the study meaningless').optional(),
    welch: welchStatisticsSchema.optional(),
  })
  .superRefine((n, ctx) => {
    if (n.sigmaLog === undefined && n.welch === undefined)
      ctx.addIssue({ code: 'custom', path: ['sigmaLog'], message: "give sigmaLog or the spectra's welch statistics" });
  });

export type StudyNoise = z.infer<typeof noiseSchema>;

export const studyCaseSchema = caseSchema.and(z.looseObject({ noise: noiseSchema })).superRefine((c, ctx) => {
  if (!c.sources || c.sources.length === 0)
    ctx.addIssue({ code: 'custom', path: ['sources'], message: 'a study needs the sources (the solution or the truth)' });
  if (!c.unknowns || c.unknowns.length === 0)
    ctx.addIssue({ code: 'custom', path: ['unknowns'], message: 'a study needs at least one unknown to solve for' });
});

export type StudyCase = z.infer<typeof studyCaseSchema>;

/** One candidate site of `siting`; `sigmaLog` defaults to the case's noise. */
export const candidateSchema = z.looseObject({
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-360).max(360),
  components: z
    .array(z.enum(COMPONENTS))
    .min(1)
    .refine((c) => new Set(c).size === c.length, 'components must not repeat'),
  sigmaLog: z.number().positive('sigmaLog must be above 0: noise of zero or less makes the study meaningless').optional(),
});

export type CandidateSite = z.infer<typeof candidateSchema>;

export const candidatesSchema = z.array(candidateSchema).min(1, 'give at least one candidate site');
