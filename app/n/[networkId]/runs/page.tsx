import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listRuns } from '@/src/runs/control';
import { ButtonLink, Caution, DataTable, EmptyState, Panel } from '@/src/web/ui';
import { ImportCaseButton } from '@/src/web/runs/ImportCaseButton';

export const metadata = { title: 'Runs · Cavitas' };

export default async function RunsPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const runs = await listRuns(networkId);
  const launch = can(membership.role, 'runs.launch');
  const rows = runs.map((r) => ({
    id: r.id,
    name: r.name,
    url: `/n/${networkId}/runs/${r.id}`,
    state: r.state,
    done: r.progress.intervalsTotal ? Math.round((100 * r.progress.intervalsDone) / r.progress.intervalsTotal) : 0,
    intervals: r.intervals,
    model: `${r.modelName} v${r.modelVersion}`,
    grid: `${r.gridName} v${r.gridVersion}`,
    createdAt: r.createdAt.toISOString(),
  }));
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading="Runs"
        description="Inversions of this network's stored spectra for regional thunderstorm intensities."
        actions={
          <>
            {runs.length > 0 ? <ButtonLink href={`/n/${networkId}/compare`}>Compare side by side</ButtonLink> : null}
            {launch ? <ImportCaseButton networkId={networkId} /> : null}
            {launch ? (
              <ButtonLink href={`/n/${networkId}/runs/new`} tone="primary">
                Set up a run
              </ButtonLink>
            ) : null}
          </>
        }
      >
        <DataTable
          caption="Runs of this network"
          captionHidden
          rows={rows}
          initialSort={{ key: 'createdAt', desc: true }}
          empty={
            <EmptyState
              title="No runs yet"
              action={
                launch ? (
                  <ButtonLink href={`/n/${networkId}/runs/new`} tone="primary">
                    Set up a run
                  </ButtonLink>
                ) : null
              }
            >
              {launch
                ? 'A run needs a cavity model, a source grid with regions, and processed station data.'
                : 'Analysts and owners of this network launch runs.'}
            </EmptyState>
          }
          columns={[
            { key: 'name', header: 'Run', hrefKey: 'url' },
            { key: 'state', header: 'State' },
            { key: 'done', header: 'Done', unit: '%', numeric: true, digits: 0 },
            { key: 'intervals', header: 'Intervals', numeric: true, digits: 0 },
            { key: 'model', header: 'Cavity model' },
            { key: 'grid', header: 'Source grid' },
            { key: 'createdAt', header: 'Launched', time: true },
          ]}
        />
      </Panel>
      <Caution topic="research" />
    </div>
  );
}
