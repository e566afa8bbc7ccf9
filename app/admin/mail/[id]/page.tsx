import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { pageAdmin } from '@/src/auth/pages';
import { getMail } from '@/src/mail/mailbox';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { Card, formatUtc } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Message' };

/** One caught message, shown as plain text (HTML bodies are never rendered). */
export default async function MailMessagePage({ params }: { params: Promise<{ id: string }> }) {
  await pageAdmin();
  const { id } = await params;
  const m = await getMail(id);
  if (!m) notFound();
  const linkified = (m.text ?? '').split(/(https?:\/\/\S+)/g);
  return (
    <>
      <PageHeader title={m.subject || '(no subject)'} eyebrow={<Link href="/admin/mail">← Outgoing mail</Link>} />
      <Card>
        <dl className="mb-4 grid grid-cols-[6rem_1fr] gap-y-1 text-sm">
          <dt className="text-muted">From</dt>
          <dd>{m.from}</dd>
          <dt className="text-muted">To</dt>
          <dd>{m.to.join(', ')}</dd>
          <dt className="text-muted">Received</dt>
          <dd className="num">{formatUtc(m.receivedAt, true)}</dd>
        </dl>
        <pre
          className="overflow-x-auto rounded-md bg-raised p-4 font-mono text-[0.8125rem] leading-relaxed whitespace-pre-wrap"
          data-testid="mail-body"
        >
          {linkified.map((part, i) =>
            /^https?:\/\//.test(part) ? (
              <a key={i} href={part} className="text-accent underline break-all">
                {part}
              </a>
            ) : (
              part
            ),
          )}
        </pre>
      </Card>
    </>
  );
}
