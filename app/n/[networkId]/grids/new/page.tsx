import { pageNetworkAction } from '@/src/auth/pages';
import { Panel } from '@/src/web/ui';
import { GridEditor } from '@/src/web/grids/GridEditor';

export const metadata = { title: 'Draw a source grid · Cavitas' };

export default async function NewGridPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  await pageNetworkAction(networkId, 'grids.edit');
  return (
    <Panel level={1} heading="Draw a source grid" description="Pick a cell size, add regions, and select their cells on the map.">
      <GridEditor networkId={networkId} />
    </Panel>
  );
}
