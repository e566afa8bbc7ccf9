import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { getRunView, minimaRows, seriesRows, toCsv } from '@/src/runs/results';
import { requireId } from '@/src/runs/ids';

type P = { networkId: string; runId: string };

const query = z.object({ format: z.enum(['json', 'csv']).default('json'), what: z.enum(['minima', 'series']).default('minima') });

/** Minima of every interval, or the best-minimum series, as JSON or CSV (units in the column names). */
export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'export');
  const q = parseQuery(req, query);
  const view = await getRunView(params.networkId, requireId(params.runId, 'run'));
  const rows = q.what === 'minima' ? minimaRows(view) : seriesRows(view);
  const file = `cavitas-run-${view.run.id.slice(0, 8)}-${q.what}.${q.format}`;
  const disposition = { 'content-disposition': `attachment; filename="${file}"` };
  if (q.format === 'csv')
    return new Response(toCsv(rows), { headers: { 'content-type': 'text/csv; charset=utf-8', ...disposition } });
  return json(
    {
      run: view.run,
      config: view.config,
      model: view.model,
      grid: { id: view.grid.id, name: view.grid.name, version: view.grid.version },
      note: 'Research estimates of regional thunderstorm activity; not a lightning warning.',
      rows,
    },
    200,
    disposition,
  );
});
