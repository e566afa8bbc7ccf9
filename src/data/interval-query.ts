/**
 * Query-string form of an interval filter (list, export, spectra):
 * `station=<id>[,<id>]`, `component=Ez[,Bns]`, `from`/`to` ISO times (UTC),
 * `day=YYYY-MM-DD` as a shortcut for one UTC day, `flagged=include`.
 */
import { z } from 'zod';
import type { IntervalFilter } from '@/db/repo/intervals';
import { COMPONENTS } from '@/src/engine/components';

const list = <T extends z.ZodType>(item: T) =>
  z
    .string()
    .optional()
    .transform((s, ctx) => {
      if (s === undefined || s === '') return undefined;
      const parts = s.split(',').map((p) => p.trim());
      const out: z.infer<T>[] = [];
      for (const p of parts) {
        const r = item.safeParse(p);
        if (!r.success) {
          ctx.addIssue({ code: 'custom', message: `"${p}" is not valid here` });
          return z.NEVER;
        }
        out.push(r.data);
      }
      return out;
    });

const time = z
  .string()
  .optional()
  .transform((s, ctx) => {
    if (!s) return undefined;
    const d = new Date(s);
    if (Number.isNaN(d.getTime())) {
      ctx.addIssue({ code: 'custom', message: 'give a time like 2026-03-01T00:00:00Z' });
      return z.NEVER;
    }
    return d;
  });

export const intervalQuerySchema = z.object({
  station: list(z.uuid()),
  component: list(z.enum(COMPONENTS)),
  from: time,
  to: time,
  day: z.iso.date('give a UTC day like 2026-03-01 (a real calendar day)').optional(),
  flagged: z.enum(['include', 'exclude']).default('include'),
  clean: z.enum(['yes', 'no']).default('no'),
  format: z.enum(['csv', 'json']).default('json'),
});

export type IntervalQuery = z.infer<typeof intervalQuerySchema>;

export function toFilter(networkId: string, q: IntervalQuery): IntervalFilter {
  let { from, to } = q;
  if (q.day) {
    from = new Date(`${q.day}T00:00:00Z`);
    to = new Date(from.getTime() + 86_400_000);
  }
  return {
    networkId,
    stationIds: q.station,
    components: q.component,
    from,
    to,
    includeFlagged: q.flagged === 'include',
    requireClean: q.clean === 'yes',
  };
}
