import { requireNetworkAction } from '@/src/auth/permissions';
import { route } from '@/src/server/route';
import { requireId } from '@/src/server/ids';
import { intervalSpectrumCsv } from '@/src/data/spectrum-export';

type P = { networkId: string; intervalId: string };

/** The interval's spectrum as a CSV file in the Cavitas spectra layout (SI units). */
export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'export');
  const f = await intervalSpectrumCsv(params.networkId, requireId(params.intervalId, 'interval'));
  return new Response(f.text, {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${f.file}"` },
  });
});
