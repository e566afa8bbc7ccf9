import { pageNetworkAction } from '@/src/auth/pages';
import { Panel } from '@/src/web/ui';
import { ModelEditor } from '@/src/web/models/ModelEditor';

export const metadata = { title: 'Describe a cavity model · Cavitas' };

export default async function NewModelPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  await pageNetworkAction(networkId, 'models.edit');
  return (
    <Panel
      level={1}
      heading="Describe a cavity model"
      description="The figures below follow your entries; check them before saving."
    >
      <ModelEditor networkId={networkId} />
    </Panel>
  );
}
