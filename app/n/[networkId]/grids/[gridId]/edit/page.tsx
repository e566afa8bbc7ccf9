import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { getGrid } from '@/src/runs/catalogue';
import { regionSchema } from '@/src/runs/grid-spec';
import { Panel } from '@/src/web/ui';
import { GridEditor } from '@/src/web/grids/GridEditor';

export const metadata = { title: 'Edit source grid · Cavitas' };

export default async function EditGridPage({ params }: { params: Promise<{ networkId: string; gridId: string }> }) {
  const { networkId, gridId } = await params;
  await pageNetworkAction(networkId, 'grids.edit');
  const grid = /^[0-9a-f-]{36}$/i.test(gridId) ? await getGrid(networkId, gridId) : null;
  if (!grid) notFound();
  return (
    <Panel
      level={1}
      heading={`Edit ${grid.name}`}
      description={`Saving adds version ${grid.version + 1}; version ${grid.version} stays as it is for the runs that used it.`}
    >
      <GridEditor
        networkId={networkId}
        baseId={grid.id}
        initial={{
          name: grid.name,
          notes: grid.notes,
          cellSizeDeg: grid.cellSizeDeg,
          regions: grid.regions.map((r) => regionSchema.parse(r)),
        }}
      />
    </Panel>
  );
}
