import type { Metadata } from 'next';
import { pageNetworkAction } from '@/src/auth/pages';
import { AUDIT_PAGE_ROWS, auditTrail } from '@/src/audit';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { DataTable, EmptyState, Panel } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Audit trail' };

export default async function AuditPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  await pageNetworkAction(networkId, 'audit.read');
  const entries = await auditTrail(networkId);
  return (
    <>
      <PageHeader
        title="Audit trail"
        subtitle="Who created, changed, shared, exported, imported or deleted what in this network, and when (UTC). Only owners see it."
      />
      <Panel
        heading={`Latest ${AUDIT_PAGE_ROWS} entries`}
        actions={
          <a className="text-sm font-medium text-accent underline" href={`/api/networks/${networkId}/audit?format=csv`} download>
            Whole trail (CSV)
          </a>
        }
      >
        {entries.length ? (
          <DataTable
            caption="Audit trail, newest first"
            captionHidden
            rows={entries.map((e) => ({ ...e }))}
            columns={[
              { key: 'at', header: 'When', time: true },
              { key: 'actor', header: 'Who' },
              { key: 'action', header: 'Did' },
              { key: 'subject', header: 'To' },
              { key: 'summary', header: 'What' },
            ]}
          />
        ) : (
          <EmptyState title="Nothing recorded yet">
            Entries appear as members create, change, share, export, import or delete.
          </EmptyState>
        )}
      </Panel>
    </>
  );
}
