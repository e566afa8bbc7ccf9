import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { listIntervals } from '@/src/data/intervals';
import { intervalQuerySchema, toFilter } from '@/src/data/interval-query';
import { intervalsToCsv, intervalsToJson } from '@/src/data/exports';

type P = { networkId: string };

/** Intervals and fits as a download: `?format=csv|json` plus the list filters. */
export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'export');
  const q = parseQuery(req, intervalQuerySchema);
  const rows = await listIntervals(toFilter(params.networkId, q));
  const stamp = new Date().toISOString().slice(0, 10);
  if (q.format === 'csv') {
    return new Response(intervalsToCsv(rows), {
      headers: {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': `attachment; filename="cavitas-intervals-${stamp}.csv"`,
      },
    });
  }
  return json(intervalsToJson(params.networkId, rows), 200, {
    'content-disposition': `attachment; filename="cavitas-intervals-${stamp}.json"`,
  });
});
