import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listStations } from '@/db/repo/stations';
import { firstView, getRunView } from '@/src/runs/results';
import { AppError } from '@/src/server/errors';
import { Panel } from '@/src/web/ui/Card';
import { RunPage } from '@/src/web/runs/RunPage';
import { fitsUrl, runApi } from '@/src/web/runs/types';
import { SettingsSummary } from '@/src/web/runs/SettingsSummary';
import { RunMapFrame } from '@/src/web/runs/RunMapFrame';

export const metadata = { title: 'Run · Cavitas' };

export default async function RunDetailPage({ params }: { params: Promise<{ networkId: string; runId: string }> }) {
  const { networkId, runId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const view = await getRunView(networkId, /^[0-9a-f-]{36}$/i.test(runId) ? runId : '00000000-0000-0000-0000-000000000000').catch((e) => {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  });
  // The fitted spectra of the interval the page opens on are fetched while the page loads, not after hydration.
  const open = view.intervals.filter((i) => i.result && i.result.minima.length).at(-1);
  const early = open && view.config.observables.kind === 'spectrum' ? fitsUrl(runApi(networkId, view.run.id), open.startsAt, 0) : null;
  const stations = await listStations(networkId);
  const codes = view.config.data.stationIds.map((id) => stations.find((s) => s.id === id)?.code ?? 'removed station');
  return (
    <div className="space-y-6">
      {early ? <link rel="preload" as="fetch" href={early} crossOrigin="anonymous" /> : null}
      <Panel heading={view.run.name} description="What was asked: the settings this run used, one click from the model and grid versions it pinned.">
        <SettingsSummary view={view} stationCodes={codes} networkId={networkId} />
      </Panel>
      <RunPage networkId={networkId} initial={JSON.parse(JSON.stringify(firstView(view)))} map={<RunMapFrame />}
        canCancel={can(membership.role, 'runs.cancel')} canLaunch={can(membership.role, 'runs.launch')} canDelete={can(membership.role, 'runs.delete')} />
    </div>
  );
}
