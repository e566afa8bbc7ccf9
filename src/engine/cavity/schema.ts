/** zod schema of a cavity configuration (shared by case files, forms and runs). */
import { z } from 'zod';
import { DEFAULT_EARTH_RADIUS_KM, DEFAULT_HEIGHT_KM } from '../constants';
import { tableProblems } from './table';
import type { CavityConfig } from './types';

const row = z.tuple([z.number(), z.number(), z.number()]);

export const cavityTableSchema = z
  .object({ columns: z.enum(['speed-attenuation', 'nu']), rows: z.array(row) })
  .superRefine((t, ctx) => {
    for (const p of tableProblems(t)) ctx.addIssue({ code: 'custom', path: p.path, message: p.message });
  });

export const cavityConfigSchema = z
  .looseObject({
    model: z.enum(['linear', 'ishaq-jones', 'table']),
    earthRadiusKm: z.number().positive().max(1e5).default(DEFAULT_EARTH_RADIUS_KM),
    heightKm: z.number().positive().max(1e4).default(DEFAULT_HEIGHT_KM),
    table: cavityTableSchema.optional(),
  })
  .superRefine((c, ctx) => {
    if (c.model === 'table' && !c.table)
      ctx.addIssue({ code: 'custom', path: ['table'], message: 'a table is required when model is "table"' });
  }) satisfies z.ZodType<CavityConfig, unknown>;
