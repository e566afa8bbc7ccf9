import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listStations } from '@/src/data/stations';
import { ButtonLink, Caution, DataTable, EmptyState, Panel } from '@/src/web/ui';
import { StationMap } from '@/src/web/stations/StationMap';

export const metadata = { title: 'Stations · Cavitas' };

export default async function StationsPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const stations = await listStations(networkId);
  const manage = can(membership.role, 'stations.manage');
  const rows = stations.map((s) => ({
    id: s.id,
    code: s.code,
    name: s.name,
    url: `/n/${networkId}/stations/${s.id}`,
    latitude: s.latitude,
    longitude: s.longitude,
    components: s.components.map((c) => c.component).join(' '),
    mainsHz: s.mainsHz,
    status: s.status,
    intervalCount: s.intervalCount,
    lastIntervalAt: s.lastIntervalAt?.toISOString() ?? null,
  }));
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading="Stations"
        description="Where this network records the Earth–ionosphere cavity, and how much processed data each station holds."
        actions={
          manage ? (
            <ButtonLink href={`/n/${networkId}/stations/new`} tone="primary">
              Add a station
            </ButtonLink>
          ) : null
        }
      >
        {stations.length ? (
          <StationMap
            title="Stations of this network"
            stations={stations.map(({ id, code, name, latitude, longitude }) => ({ id, code, name, latitude, longitude }))}
          />
        ) : null}
        <DataTable
          caption="Station list"
          captionHidden
          rows={rows}
          initialSort={{ key: 'code' }}
          empty={
            <EmptyState
              title="No stations yet"
              action={
                manage ? (
                  <ButtonLink href={`/n/${networkId}/stations/new`} tone="primary">
                    Add a station
                  </ButtonLink>
                ) : null
              }
            >
              {manage
                ? 'Add the first station with its position, components and calibration; then upload its files.'
                : 'An owner of this network adds stations.'}
            </EmptyState>
          }
          columns={[
            { key: 'code', header: 'Code', hrefKey: 'url' },
            { key: 'name', header: 'Name' },
            { key: 'latitude', header: 'Lat', unit: '°', numeric: true, digits: 2 },
            { key: 'longitude', header: 'Lon', unit: '°', numeric: true, digits: 2 },
            { key: 'components', header: 'Components' },
            { key: 'mainsHz', header: 'Mains', unit: 'Hz', numeric: true, digits: 0 },
            { key: 'status', header: 'Status' },
            { key: 'intervalCount', header: 'Intervals', numeric: true, digits: 0 },
            { key: 'lastIntervalAt', header: 'Newest interval', time: true },
          ]}
        />
      </Panel>
      <Caution topic="field" />
    </div>
  );
}
