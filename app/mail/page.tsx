import type { Metadata } from 'next';
import { pageUser } from '@/src/auth/pages';
import { listNetworksForUser } from '@/src/auth/networks';
import { ownMail } from '@/src/mail/mailbox';
import { AppShell } from '@/src/web/shell/AppShell';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { DataTable, EmptyState } from '@/src/web/ui';

export const metadata: Metadata = { title: 'My mail' };

/** The signed-in person's own caught mail (reset links, invitations, notices). */
export default async function MyMailPage() {
  const user = await pageUser();
  const [messages, networks] = await Promise.all([ownMail(user), listNetworksForUser(user.id)]);
  const rows = messages.map((m) => ({
    id: m.id,
    url: `/mail/${m.id}`,
    subject: m.subject || '(no subject)',
    receivedAt: m.receivedAt.toISOString(),
  }));
  return (
    <AppShell user={user} networks={networks}>
      <PageHeader
        title="My mail"
        subtitle={`Messages this instance sent to ${user.email}, as caught by the local mail catcher. Newest first.`}
      />
      <DataTable
        caption="Your messages"
        captionHidden
        rows={rows}
        columns={[
          { key: 'receivedAt', header: 'Received', time: true },
          { key: 'subject', header: 'Subject', hrefKey: 'url' },
        ]}
        initialSort={{ key: 'receivedAt', desc: true }}
        empty={<EmptyState title="No mail for you yet">Password-reset links and notices sent to you appear here.</EmptyState>}
      />
    </AppShell>
  );
}
