import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listStations } from '@/src/data/stations';
import { getRunSummary } from '@/src/runs/results';
import { AppError } from '@/src/server/errors';
import { Panel } from '@/src/web/ui/Card';
import { RunPage } from '@/src/web/runs/RunPage';
import { fitsUrl, runApi } from '@/src/web/runs/types';
import { fitsAt } from '@/src/runs/fits';
import { firstFigures } from '@/src/web/runs/figures/prerender';
import { openingInterval } from '@/src/runs/view-select';
import { SettingsSummary } from '@/src/web/runs/SettingsSummary';
import { RunMapFrame } from '@/src/web/runs/RunMapFrame';
import { RunLinksPanel } from '@/src/web/sharing/RunLinksPanel';
import { CommentsPanel } from '@/src/web/sharing/CommentsPanel';
import { commentTargets } from '@/src/sharing/comment-targets';

export const metadata = { title: 'Run · Cavitas' };

export default async function RunDetailPage({ params }: { params: Promise<{ networkId: string; runId: string }> }) {
  const { networkId, runId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const view = await getRunSummary(
    networkId,
    /^[0-9a-f-]{36}$/i.test(runId) ? runId : '00000000-0000-0000-0000-000000000000',
  ).catch((e) => {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  });
  // The view the page opens on comes computed and drawn: its fits and figures are in the HTML.
  const open = openingInterval(view.intervals);
  const [stations, fits] = await Promise.all([
    listStations(networkId),
    // As the fits API answers it (JSON); on failure the browser asks the API, which says why.
    open
      ? fitsAt(networkId, view.run.id, open.startsAt, 0).then(
          (f) => JSON.parse(JSON.stringify(f)) as typeof f,
          () => null,
        )
      : null,
  ]);
  const first = {
    figures: firstFigures(view, fits),
    fits: open && fits ? { url: fitsUrl(runApi(networkId, view.run.id), open.startsAt, 0), data: fits } : null,
  };
  const codes = view.config.data.stationIds.map((id) => stations.find((s) => s.id === id)?.code ?? 'removed station');
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading={view.run.name}
        description="What was asked: the settings this run used, one click from the model and grid versions it pinned."
      >
        <SettingsSummary view={view} stationCodes={codes} networkId={networkId} />
      </Panel>
      <RunPage
        networkId={networkId}
        first={first}
        initial={JSON.parse(JSON.stringify(view))}
        map={<RunMapFrame />}
        canCancel={can(membership.role, 'runs.cancel')}
        canLaunch={can(membership.role, 'runs.launch')}
        canDelete={can(membership.role, 'runs.delete')}
      />
      <Panel
        heading="Shared by link"
        description="Read-only links for people outside the network: they open this run's map, minima and fits, nothing else, until they expire or are revoked."
      >
        <RunLinksPanel base={runApi(networkId, view.run.id)} canShare={can(membership.role, 'runs.share')} />
      </Panel>
      <Panel heading="Comments" description="Notes on this run or on one of its minima, with who wrote them and when.">
        <CommentsPanel
          url={`${runApi(networkId, view.run.id)}/comments`}
          canWrite={can(membership.role, 'comments.write')}
          intervals={commentTargets(view.intervals)}
        />
      </Panel>
    </div>
  );
}
