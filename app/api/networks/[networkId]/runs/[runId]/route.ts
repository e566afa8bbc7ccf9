import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { getIntervalView, getRunSummary, getRunView } from '@/src/runs/results';
import { removeRun } from '@/src/runs/control';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string };

const query = z.object({
  /** One interval whole: `{ interval }`. */
  interval: z.iso
    .datetime({ offset: true, error: 'give the interval start as an ISO time like 2026-03-01T00:10:00Z' })
    .transform((s) => new Date(s))
    .optional(),
  /** `full`: every interval's whole result (large for a long run). */
  detail: z.enum(['summary', 'full'], { error: 'detail: give "summary" or "full"' }).default('summary'),
});

/**
 * The run with its settings and progress. By default a summary: every interval's best minimum and
 * counts, the last solved interval whole. `?interval=<ISO time>` gives one interval whole,
 * `?detail=full` every interval whole.
 */
export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const runId = requireId(params.runId, 'run');
  const q = parseQuery(req, query);
  const noStore = { 'cache-control': 'no-store' };
  if (q.interval) return json({ interval: await getIntervalView(params.networkId, runId, q.interval) }, 200, noStore);
  const view = q.detail === 'full' ? getRunView : getRunSummary;
  return json(await view(params.networkId, runId), 200, noStore);
});

export const DELETE = route<P>(async (_req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.delete');
  await removeRun(params.networkId, requireId(params.runId, 'run'), user.id);
  return json({ deleted: true });
});
