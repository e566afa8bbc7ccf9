import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { getStationOrNull } from '@/src/data/stations';
import { Panel } from '@/src/web/ui';
import { StationForm } from '@/src/web/stations/StationForm';
import { DeleteStation } from '@/src/web/stations/DeleteStation';

export const metadata = { title: 'Edit station · Cavitas' };

export default async function EditStationPage({ params }: { params: Promise<{ networkId: string; stationId: string }> }) {
  const { networkId, stationId } = await params;
  await pageNetworkAction(networkId, 'stations.manage');
  const station = await getStationOrNull(networkId, stationId);
  if (!station) notFound();
  const { id: _id, networkId: _n, createdAt: _c, updatedAt: _u, ...value } = station;
  return (
    <div className="max-w-3xl space-y-8">
      <Panel level={1} heading={`Edit ${station.code}`}>
        <StationForm networkId={networkId} stationId={station.id} initial={value} />
      </Panel>
      <Panel heading="Remove this station">
        <DeleteStation networkId={networkId} stationId={station.id} code={station.code} />
      </Panel>
    </div>
  );
}
