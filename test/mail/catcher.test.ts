import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startCatcher, type Catcher } from '@/src/mail/catcher';
import { sendMail } from '@/src/server/mail';
import { getMail, listMail } from '@/db/repo/mail';
import { closeDatabase } from '../helpers/db';

describe('mail: nodemailer → catcher → mail_messages', () => {
  let catcher: Catcher;
  beforeAll(async () => {
    catcher = await startCatcher({ port: 0 });
    process.env.SMTP_HOST = '127.0.0.1';
    process.env.SMTP_PORT = String(catcher.port);
  });
  afterAll(async () => {
    await catcher.close();
    await closeDatabase();
  });

  it('stores sender, recipients, subject, text, html and the raw message', async () => {
    const tag = `probe-${Date.now()}-${Math.random().toString(36).slice(2)}`;
    const to = `${tag}@example.test`;
    // Non-ASCII subject: nodemailer encodes it as an RFC 2047 encoded-word; the parser must decode it.
    const subject = `Ωmega check ${tag}`;
    await sendMail({ to, subject, text: 'Mode 1 near 7.8 Hz\nsecond line', html: '<p>Mode <b>1</b></p>' });

    const listed = await listMail({ to });
    expect(listed).toHaveLength(1);
    const msg = await getMail(listed[0].id);
    expect(msg).not.toBeNull();
    expect(msg!.from).toBe('cavitas@localhost');
    expect(msg!.to).toEqual([to]);
    expect(msg!.subject).toBe(subject);
    expect(msg!.text?.trim()).toBe('Mode 1 near 7.8 Hz\nsecond line');
    expect(msg!.html).toContain('<p>Mode <b>1</b></p>');
    // RFC 5322 headers are present in the raw source, the subject encoded (RFC 2047 "=?UTF-8?").
    expect(msg!.raw).toMatch(/^Subject: =\?UTF-8\?/im);
    expect(msg!.raw).toMatch(new RegExp(`^To: ${to}`, 'im'));
    expect(msg!.sizeBytes).toBe(Buffer.byteLength(msg!.raw));
    expect(Math.abs(msg!.receivedAt.getTime() - Date.now())).toBeLessThan(60_000);
  });

  it('keeps every envelope recipient and lists newest first', async () => {
    const a = `a-${Date.now()}@example.test`;
    const b = `b-${Date.now()}@example.test`;
    await sendMail({ to: [a, b], subject: 'first', text: 'one' });
    await sendMail({ to: a, subject: 'second', text: 'two' });
    const forA = await listMail({ to: a.toUpperCase() });
    expect(forA.map((m) => m.subject)).toEqual(['second', 'first']);
    expect(forA[1].to).toEqual([a, b]);
  });

  it('rejects a malformed recipient before talking SMTP, and unknown ids read as null', async () => {
    await expect(sendMail({ to: 'not-an-address', subject: 'x', text: 'y' })).rejects.toThrow(/invalid recipient/);
    expect(await getMail('not-a-uuid')).toBeNull();
    expect(await getMail('00000000-0000-4000-8000-000000000000')).toBeNull();
  });
});
