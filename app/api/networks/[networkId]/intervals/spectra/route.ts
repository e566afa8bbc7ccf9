import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { daySpectra } from '@/src/data/intervals';
import { intervalQuerySchema, toFilter } from '@/src/data/interval-query';

type P = { networkId: string };
const schema = intervalQuerySchema.extend({
  maxHz: z.coerce.number().positive().max(10000).default(60),
  minHz: z.coerce.number().min(0).default(0),
});

/** Spectra (SI units) of the selected intervals, cut to [minHz, maxHz], for spectrograms and fit views. */
export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const q = parseQuery(req, schema);
  return json({ spectra: await daySpectra(toFilter(params.networkId, q), q.minHz, q.maxHz) });
});
