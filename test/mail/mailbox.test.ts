/**
 * Who sees what in the local mailbox: each person reads their own messages whole; an
 * administrator sees every envelope (to, subject, time) but never the body of another person's
 * message — a reset link there would let the administrator take over that account.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { storeMail } from '@/db/repo/mail';
import { allEnvelopes, ownMail, readMail } from '@/src/mail/mailbox';
import type { User } from '@/src/auth/session';

const alice: User = { id: 'u-alice', email: 'alice@example.org', name: 'Alice', isAdmin: false };
const bob: User = { id: 'u-bob', email: 'bob@example.org', name: 'Bob', isAdmin: false };
const admin: User = { id: 'u-admin', email: 'admin@example.org', name: 'Admin', isAdmin: true };
const TOKEN = 'live-token-0123456789abcdef';
let toAlice = '';
let toAdmin = '';

async function store(to: string, subject: string, text: string): Promise<string> {
  const raw = `To: ${to}\r\nSubject: ${subject}\r\n\r\n${text}`;
  return (await storeMail({ from: 'cavitas@localhost', to: [to], subject, text, raw, sizeBytes: raw.length })).id;
}

beforeAll(async () => {
  await resetDatabase();
  toAlice = await store('Alice@Example.org', 'Cavitas: choose a new password', `http://x.test/reset-password?token=${TOKEN}`);
  toAdmin = await store('admin@example.org', 'Cavitas: notice', 'Hello admin');
});
afterAll(closeDatabase);

describe('mailbox', () => {
  it('a person lists and reads their own mail whole (address matched without case)', async () => {
    expect((await ownMail(alice)).map((m) => m.id)).toEqual([toAlice]);
    const m = await readMail(alice, toAlice);
    expect(m?.own).toBe(true);
    expect(m?.text).toContain(TOKEN);
  });

  it('another person can neither list nor open it', async () => {
    expect(await ownMail(bob)).toEqual([]);
    expect(await readMail(bob, toAlice)).toBeNull();
  });

  it('an administrator sees every envelope, but not the body of mail to someone else', async () => {
    const { envelopes, total } = await allEnvelopes(admin);
    expect(total).toBe(2);
    const env = envelopes.find((e) => e.id === toAlice)!;
    expect(env).toMatchObject({ to: ['Alice@Example.org'], subject: 'Cavitas: choose a new password', own: false });
    expect(JSON.stringify(envelopes)).not.toContain(TOKEN);
    const opened = await readMail(admin, toAlice);
    expect(opened).toMatchObject({ id: toAlice, subject: 'Cavitas: choose a new password', text: null, own: false });
    expect(JSON.stringify(opened)).not.toContain(TOKEN);
    expect((await readMail(admin, toAdmin))?.text).toBe('Hello admin'); // their own mail in full
  });

  it('an unknown or malformed id is not found', async () => {
    expect(await readMail(admin, '00000000-0000-4000-8000-000000000000')).toBeNull();
    expect(await readMail(admin, 'not-an-id')).toBeNull();
  });
});
