import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { pageUser } from '@/src/auth/pages';
import { listNetworksForUser } from '@/src/auth/networks';
import { readMail } from '@/src/mail/mailbox';
import { AppShell } from '@/src/web/shell/AppShell';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { Card, Notice, formatUtc } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Message' };

/**
 * One caught message: the whole text for its recipient (as plain text; HTML bodies are never
 * rendered), the envelope alone for an administrator reading someone else's mail.
 */
export default async function MailMessagePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser();
  const { id } = await params;
  const [m, networks] = await Promise.all([readMail(user, id), listNetworksForUser(user.id)]);
  if (!m) notFound();
  const back = m.own ? { href: '/mail', label: '← My mail' } : { href: '/admin/mail', label: '← Outgoing mail' };
  return (
    <AppShell user={user} networks={networks}>
      <PageHeader title={m.subject || '(no subject)'} eyebrow={<Link href={back.href}>{back.label}</Link>} />
      <Card>
        <dl className="mb-4 grid grid-cols-[6rem_1fr] gap-y-1 text-sm">
          <dt className="text-muted">From</dt>
          <dd>{m.from}</dd>
          <dt className="text-muted">To</dt>
          <dd>{m.to.join(', ')}</dd>
          <dt className="text-muted">Received</dt>
          <dd className="num">{formatUtc(m.receivedAt, true)}</dd>
        </dl>
        {m.text === null ? (
          <div data-testid="mail-withheld">
            <Notice>
              Only the recipient can read this message: it may hold a link that resets a password or lets someone join a network.
            </Notice>
          </div>
        ) : (
          <pre
            className="overflow-x-auto rounded-md bg-raised p-4 font-mono text-[0.8125rem] leading-relaxed whitespace-pre-wrap"
            data-testid="mail-body"
          >
            {m.text.split(/(https?:\/\/\S+)/g).map((part, i) =>
              /^https?:\/\//.test(part) ? (
                <a key={i} href={part} className="text-accent underline break-all">
                  {part}
                </a>
              ) : (
                part
              ),
            )}
          </pre>
        )}
      </Card>
    </AppShell>
  );
}
