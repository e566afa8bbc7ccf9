import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { getModel } from '@/src/runs/catalogue';
import { Panel } from '@/src/web/ui';
import { ModelEditor } from '@/src/web/models/ModelEditor';
import type { CavityConfig } from '@/src/engine/cavity/types';

export const metadata = { title: 'Edit cavity model · Cavitas' };

export default async function EditModelPage({ params }: { params: Promise<{ networkId: string; modelId: string }> }) {
  const { networkId, modelId } = await params;
  await pageNetworkAction(networkId, 'models.edit');
  const model = /^[0-9a-f-]{36}$/i.test(modelId) ? await getModel(networkId, modelId) : null;
  if (!model) notFound();
  return (
    <Panel
      level={1}
      heading={`Edit ${model.name}`}
      description={`Saving adds version ${model.version + 1}; version ${model.version} stays as it is for the runs that used it.`}
    >
      <ModelEditor
        networkId={networkId}
        baseId={model.id}
        initial={{ name: model.name, notes: model.notes, config: model.config as unknown as CavityConfig }}
      />
    </Panel>
  );
}
