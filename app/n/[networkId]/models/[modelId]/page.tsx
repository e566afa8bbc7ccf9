import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listModelVersions } from '@/src/runs/catalogue';
import { ButtonLink, Panel } from '@/src/web/ui';
import { ModelCurves } from '@/src/web/models/ModelCurves';
import type { CavityConfig } from '@/src/engine/cavity/types';
import { isId } from '@/src/server/ids';

export const metadata = { title: 'Cavity model · Cavitas' };

export default async function ModelPage({ params }: { params: Promise<{ networkId: string; modelId: string }> }) {
  const { networkId, modelId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  if (!isId(modelId)) notFound();
  const versions = await listModelVersions(networkId, modelId);
  const model = versions.find((v) => v.id === modelId);
  if (!model) notFound();
  const config = model.config as unknown as CavityConfig;
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading={`${model.name} · version ${model.version}`}
        description={`ν from ${config.model}${config.table ? ` (${config.table.rows.length} rows, ${config.table.columns})` : ''}; Earth radius ${config.earthRadiusKm} km; effective height ${config.heightKm} km.`}
        actions={
          can(membership.role, 'models.edit') ? (
            <ButtonLink href={`/n/${networkId}/models/${model.id}/edit`} tone="primary">
              Edit as a new version
            </ButtonLink>
          ) : null
        }
      >
        {model.notes ? <p className="mb-4 max-w-prose text-sm">{model.notes}</p> : null}
        <ModelCurves config={config} />
      </Panel>
      <Panel heading="Versions">
        <ul className="text-sm">
          {versions.map((v) => (
            <li key={v.id}>
              <a className="text-accent underline underline-offset-2" href={`/n/${networkId}/models/${v.id}`}>
                v{v.version}
              </a>{' '}
              · saved {v.createdAt.toISOString().slice(0, 16).replace('T', ' ')} UT{v.id === model.id ? ' (shown)' : ''}
            </li>
          ))}
        </ul>
      </Panel>
    </div>
  );
}
