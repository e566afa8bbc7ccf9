import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listGrids } from '@/src/runs/catalogue';
import { ButtonLink, DataTable, EmptyState, Panel } from '@/src/web/ui';

export const metadata = { title: 'Source grids · Cavitas' };

export default async function GridsPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const grids = await listGrids(networkId);
  const edit = can(membership.role, 'grids.edit');
  const rows = grids.map((g) => ({
    id: g.id,
    name: g.name,
    url: `/n/${networkId}/grids/${g.id}`,
    cell: g.cellSizeDeg,
    regions: g.regions.length,
    version: g.version,
    createdAt: g.createdAt.toISOString(),
  }));
  return (
    <Panel
      level={1}
      heading="Source grids"
      description="Where thunderstorm activity may sit: a global grid of cells and the regions drawn on it. Editing makes a new version; runs keep the version they used."
      actions={
        edit ? (
          <ButtonLink href={`/n/${networkId}/grids/new`} tone="primary">
            Draw a grid
          </ButtonLink>
        ) : null
      }
    >
      <DataTable
        caption="Source grids"
        captionHidden
        rows={rows}
        initialSort={{ key: 'name' }}
        empty={
          <EmptyState
            title="No source grids yet"
            action={
              edit ? (
                <ButtonLink href={`/n/${networkId}/grids/new`} tone="primary">
                  Draw a grid
                </ButtonLink>
              ) : null
            }
          >
            {edit
              ? 'Choose a cell size, then select cells for each region or add moving regions.'
              : 'Analysts and owners draw source grids.'}
          </EmptyState>
        }
        columns={[
          { key: 'name', header: 'Grid', hrefKey: 'url' },
          { key: 'cell', header: 'Cell size', unit: '°', numeric: true, digits: 1 },
          { key: 'regions', header: 'Regions', numeric: true, digits: 0 },
          { key: 'version', header: 'Version', numeric: true, digits: 0 },
          { key: 'createdAt', header: 'Saved', time: true },
        ]}
      />
    </Panel>
  );
}
