import type { Metadata } from 'next';
import { pageAdmin } from '@/src/auth/pages';
import { listMail, countMail } from '@/src/mail/mailbox';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { DataTable, EmptyState, Notice } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Outgoing mail' };

export default async function MailboxPage() {
  await pageAdmin();
  const [messages, total] = await Promise.all([listMail({ limit: 200 }), countMail()]);
  const rows = messages.map((m) => ({
    id: m.id,
    url: `/admin/mail/${m.id}`,
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
        Showing {rows.length} of {total}. With the local catcher nothing leaves this machine; point SMTP_HOST at a relay to
        deliver mail.
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
