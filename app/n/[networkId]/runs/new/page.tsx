import { pageNetworkAction } from '@/src/auth/pages';
import { listModels, listGrids } from '@/src/runs/catalogue';
import { listStations } from '@/src/data/stations';
import { regionSchema } from '@/src/runs/grid-spec';
import { ButtonLink, EmptyState, Panel } from '@/src/web/ui';
import { RunLauncher } from '@/src/web/runs/RunLauncher';

export const metadata = { title: 'Set up a run · Cavitas' };

export default async function NewRunPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  await pageNetworkAction(networkId, 'runs.launch');
  const [models, grids, stations] = await Promise.all([listModels(networkId), listGrids(networkId), listStations(networkId)]);
  const withData = stations.filter((s) => s.intervalCount > 0);
  const last =
    withData
      .map((s) => s.lastIntervalAt?.toISOString() ?? '')
      .sort()
      .at(-1) || null;
  const first =
    withData
      .map((s) => s.firstIntervalAt?.toISOString() ?? '')
      .filter(Boolean)
      .sort()
      .at(0) ?? null;
  const missing = !models.length
    ? 'a cavity model'
    : !grids.length
      ? 'a source grid'
      : !withData.length
        ? 'processed station data'
        : null;
  return (
    <Panel
      level={1}
      heading="Set up a run"
      description="Choose data, observables, a cavity model and source regions with bounds; check the preview, then launch. The run continues in the background."
    >
      {missing ? (
        <EmptyState
          title={`This network has no ${missing} yet`}
          action={
            !models.length ? (
              <ButtonLink href={`/n/${networkId}/models/new`} tone="primary">
                Describe a cavity model
              </ButtonLink>
            ) : !grids.length ? (
              <ButtonLink href={`/n/${networkId}/grids/new`} tone="primary">
                Draw a source grid
              </ButtonLink>
            ) : (
              <ButtonLink href={`/n/${networkId}/stations`} tone="primary">
                Go to stations
              </ButtonLink>
            )
          }
        >
          A run needs a cavity model, a source grid with regions, and processed station data.
        </EmptyState>
      ) : (
        <RunLauncher
          networkId={networkId}
          options={{
            models: models.map((m) => ({ id: m.id, name: m.name, version: m.version })),
            grids: grids.map((g) => ({
              id: g.id,
              name: g.name,
              version: g.version,
              regions: g.regions.map((r) => regionSchema.parse(r)),
            })),
            stations: withData.map((s) => ({
              id: s.id,
              code: s.code,
              name: s.name,
              components: s.components.map((c) => c.component),
            })),
            range: { first, last },
          }}
        />
      )}
    </Panel>
  );
}
