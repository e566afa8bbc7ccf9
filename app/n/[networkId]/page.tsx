import type { Metadata } from 'next';
import { pageNetworkAction } from '@/src/auth/pages';
import { can, ROLE_LABEL, ROLE_SUMMARY } from '@/src/auth/permissions';
import { listMembers } from '@/src/auth/networks';
import { listStations } from '@/src/data/stations';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { ButtonLink, Card, Caution, Notice, Panel, formatUtc } from '@/src/web/ui';
import { StationOverviewMap } from '@/src/web/networks/StationOverviewMap';
import { DemoGuide } from '@/src/web/networks/DemoGuide';
import { demoGuide } from '@/src/ops/seed/guide';

export const metadata: Metadata = { title: 'Overview' };

export default async function NetworkOverview({
  params,
  searchParams,
}: {
  params: Promise<{ networkId: string }>;
  searchParams: Promise<{ denied?: string }>;
}) {
  const { networkId } = await params;
  const { denied } = await searchParams;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const [stations, members, guide] = await Promise.all([
    listStations(networkId),
    listMembers(networkId),
    demoGuide(networkId, membership.networkName),
  ]);
  const points = stations.map((s) => ({
    id: s.id,
    code: s.code,
    name: s.name,
    lat: s.latitude,
    lon: s.longitude,
    intervals: s.intervalCount,
  }));
  const intervalTotal = stations.reduce((a, s) => a + s.intervalCount, 0);
  const newest = stations
    .map((s) => s.lastIntervalAt)
    .filter((d): d is Date => !!d)
    .sort((a, b) => b.getTime() - a.getTime())[0];
  const base = `/n/${networkId}`;
  return (
    <>
      <PageHeader
        eyebrow="Network"
        title={membership.networkName}
        subtitle={
          <>
            You are <strong className="font-medium text-fg">{ROLE_LABEL[membership.role].toLowerCase()}</strong>:{' '}
            {ROLE_SUMMARY[membership.role]}
          </>
        }
        actions={
          <>
            <ButtonLink href={`${base}/stations`}>Stations</ButtonLink>
            {can(membership.role, 'runs.launch') ? (
              <ButtonLink href={`${base}/runs`} tone="primary">
                Runs
              </ButtonLink>
            ) : null}
          </>
        }
      />
      {denied ? (
        <Notice tone="error" className="mb-4">
          Your role in this network ({membership.role}) does not allow the page you tried to open. Ask an owner if you need it.
        </Notice>
      ) : null}
      {guide ? <DemoGuide guide={guide} networkId={networkId} /> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,1fr)]">
        <Panel heading="Stations on the map" description="Equal-area projection; each dot is a station of this network.">
          <Card flush>
            <StationOverviewMap stations={points} networkId={networkId} />
          </Card>
        </Panel>
        <div className="space-y-4">
          <Card title="At a glance">
            <dl className="grid grid-cols-2 gap-x-3 gap-y-3 text-sm">
              <dt className="text-muted">Stations</dt>
              <dd className="num text-right font-mono">{stations.length}</dd>
              <dt className="text-muted">Intervals</dt>
              <dd className="num text-right font-mono">{intervalTotal}</dd>
              <dt className="text-muted">Members</dt>
              <dd className="num text-right font-mono">{members.length}</dd>
              <dt className="text-muted">Newest interval</dt>
              <dd className="num text-right font-mono text-xs">{newest ? formatUtc(newest) : '—'}</dd>
            </dl>
          </Card>
          <Caution topic="research" />
          <Caution topic="field" />
        </div>
      </div>
    </>
  );
}
