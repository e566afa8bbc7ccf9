import type { Metadata } from 'next';
import { pageAdmin } from '@/src/auth/pages';
import { allEnvelopes } from '@/src/mail/mailbox';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { DataTable, EmptyState, Notice } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Outgoing mail' };

/** Envelopes of everything this instance sent; bodies only of the administrator's own mail. */
export default async function MailboxPage() {
  const user = await pageAdmin();
  const { envelopes, total } = await allEnvelopes(user);
  const rows = envelopes.map((m) => ({
    id: m.id,
    url: `/mail/${m.id}`,
    subject: m.subject || '(no subject)',
    to: m.to.join(', '),
    receivedAt: m.receivedAt.toISOString(),
    size: m.sizeBytes / 1024,
  }));
  return (
    <>
      <PageHeader
        title="Outgoing mail"
        subtitle="Messages this instance sent (invitations, password resets), as caught by the local mail catcher. Newest first."
      />
      <Notice className="mb-4">
        Showing {rows.length} of {total}. You see who each message went to, its subject and time; only its recipient can read it
        (under My mail), since it may hold a live link. With the local catcher nothing leaves this machine; point SMTP_HOST at a
        relay to deliver mail.
      </Notice>
      <DataTable
        caption="Caught messages"
        captionHidden
        rows={rows}
        columns={[
          { key: 'receivedAt', header: 'Received', time: true },
          { key: 'to', header: 'To' },
          { key: 'subject', header: 'Subject', hrefKey: 'url' },
          { key: 'size', header: 'Size', unit: 'KiB', numeric: true, digits: 1 },
        ]}
        initialSort={{ key: 'receivedAt', desc: true }}
        empty={
          <EmptyState title="No mail yet">Invitations and password-reset messages appear here once they are sent.</EmptyState>
        }
      />
    </>
  );
}
