import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { getRunView, minimaRows, seriesRows, toCsv } from '@/src/runs/results';
import { requireId } from '@/src/server/ids';
import { runCaseFile } from '@/src/runs/case-file';

type P = { networkId: string; runId: string };

const query = z.object({
  format: z.enum(['json', 'csv']).default('json'),
  what: z.enum(['minima', 'series', 'case']).default('minima'),
  /** what=case: the interval (its start time or id); needed when the run has more than one. */
  interval: z.string().min(1).max(64).optional(),
});

/**
 * Minima of every interval, or the best-minimum series, as JSON or CSV (units in the column names);
 * or (what=case) one interval as a case file for the command line's `invert`.
 */
export const GET = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'export');
  const q = parseQuery(req, query);
  if (q.what === 'case') {
    const c = await runCaseFile(params.networkId, requireId(params.runId, 'run'), user.id, q.interval);
    return json(c.body, 200, { 'content-disposition': `attachment; filename="${c.file}"`, 'cache-control': 'no-store' });
  }
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
