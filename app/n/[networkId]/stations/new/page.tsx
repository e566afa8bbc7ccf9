import { pageNetworkAction } from '@/src/auth/pages';
import { Caution, Panel } from '@/src/web/ui';
import { StationForm } from '@/src/web/stations/StationForm';

export const metadata = { title: 'New station · Cavitas' };

export default async function NewStationPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  await pageNetworkAction(networkId, 'stations.manage');
  return (
    <div className="max-w-3xl space-y-6">
      <Panel
        level={1}
        heading="Add a station"
        description="Position, installed components with their calibration, and the lines to suppress at this site."
      >
        <StationForm networkId={networkId} />
      </Panel>
      <Caution topic="field" />
    </div>
  );
}
