import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { getStationOrNull, listStations } from '@/src/data/stations';
import { listStationDays } from '@/src/data/intervals';
import { formatBytes, maxUploadBytes } from '@/src/data/limits';
import { settings } from '@/src/settings';
import { ButtonLink, Caution, Card, Panel, Tabs, buttonClass, formatValue } from '@/src/web/ui';
import { StationMap } from '@/src/web/stations/StationMap';
import { DayView } from '@/src/web/stations/DayView';
import { UploadPanel } from '@/src/web/stations/UploadPanel';
import { TokenPanel } from '@/src/web/stations/TokenPanel';

export const metadata = { title: 'Station · Cavitas' };

export default async function StationPage({ params }: { params: Promise<{ networkId: string; stationId: string }> }) {
  const { networkId, stationId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const station = await getStationOrNull(networkId, stationId);
  if (!station) notFound();
  const [days, all] = await Promise.all([listStationDays(networkId, station.id), listStations(networkId)]);
  const role = membership.role;
  const exportBase = `/api/networks/${networkId}/intervals/export?station=${station.id}&flagged=include`;
  const pushUrl = `${settings().APP_URL ?? ''}/api/v1/push/intervals`;
  const facts: [string, string][] = [
    [
      'Position',
      `${formatValue(station.latitude, '', { decimals: 3 })}°, ${formatValue(station.longitude, '', { decimals: 3 })}°${station.elevationM != null ? `, ${formatValue(station.elevationM, 'm', { decimals: 0 })}` : ''}`,
    ],
    [
      'Components',
      station.components
        .map(
          (c) =>
            `${c.component} (${c.calibration.kind === 'gain' ? `gain ${formatValue(c.calibration.gain, '', 4)} per ${c.component === 'Ez' ? 'V/m' : 'T'}` : `response table, ${c.calibration.points.length} rows`})`,
        )
        .join('; '),
    ],
    ['Sampling rate', `${station.sampleRateHz} Hz`],
    ['Mains', `${station.mainsHz} Hz and harmonics`],
    ['Other lines', station.interferenceLines.map((l) => `${l.frequencyHz} Hz ${l.label}`).join('; ') || 'none listed'],
    ['Status', station.status],
  ];
  const tabs = [
    {
      id: 'day',
      label: 'Day view',
      content: (
        <DayView
          networkId={networkId}
          stationId={station.id}
          components={station.components.map((c) => c.component)}
          days={days}
          canFlag={can(role, 'data.flag')}
        />
      ),
    },
    {
      id: 'files',
      label: 'Files',
      content: (
        <UploadPanel
          networkId={networkId}
          stationId={station.id}
          stationCode={station.code}
          canUpload={can(role, 'data.upload')}
          maxBytesLabel={formatBytes(maxUploadBytes())}
        />
      ),
    },
    ...(can(role, 'tokens.manage')
      ? [
          {
            id: 'tokens',
            label: 'Push tokens',
            content: <TokenPanel networkId={networkId} stationId={station.id} pushUrl={pushUrl} />,
          },
        ]
      : []),
  ];
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading={`${station.code} — ${station.name}`}
        description="Station details, its processed intervals by UTC day, and its files."
        actions={
          <>
            <a href={`${exportBase}&format=csv`} download className={buttonClass('secondary', 'sm')}>
              Export CSV
            </a>
            <a href={`${exportBase}&format=json`} download className={buttonClass('secondary', 'sm')}>
              Export JSON
            </a>
            {can(role, 'stations.manage') ? (
              <ButtonLink href={`/n/${networkId}/stations/${station.id}/edit`} size="sm">
                Edit
              </ButtonLink>
            ) : null}
          </>
        }
      >
        <div className="grid gap-4 lg:grid-cols-[1fr_22rem]">
          <Card flush>
            <StationMap
              title={`Position of ${station.code}`}
              current={station.id}
              stations={all.map(({ id, code, name, latitude, longitude }) => ({ id, code, name, latitude, longitude }))}
            />
          </Card>
          <Card title="Station">
            <dl className="space-y-2 text-sm">
              {facts.map(([k, v]) => (
                <div key={k}>
                  <dt className="text-muted">{k}</dt>
                  <dd className="num">{v}</dd>
                </div>
              ))}
              {station.notes ? (
                <div>
                  <dt className="text-muted">Notes</dt>
                  <dd className="whitespace-pre-wrap">{station.notes}</dd>
                </div>
              ) : null}
            </dl>
          </Card>
        </div>
      </Panel>
      <Caution topic="field" />
      <Tabs label="Station data" items={tabs} />
    </div>
  );
}
