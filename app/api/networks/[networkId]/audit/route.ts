import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { auditCsv, auditTrail } from '@/src/audit';

type P = { networkId: string };

const query = z.object({ format: z.enum(['json', 'csv'], { error: 'format: give "json" or "csv"' }).default('json') });

/** The network's audit trail, newest first (owners only): JSON (the latest entries) or the whole trail as CSV. */
export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'audit.read');
  const { format } = parseQuery(req, query);
  const noStore = { 'cache-control': 'no-store' };
  if (format === 'json') return json({ entries: await auditTrail(params.networkId) }, 200, noStore);
  return new Response(await auditCsv(params.networkId), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': 'attachment; filename="cavitas-audit-trail.csv"',
      ...noStore,
    },
  });
});
