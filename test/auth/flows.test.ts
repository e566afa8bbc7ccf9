/**
 * Account and invitation flows through the route handlers, with the local
 * mail catcher receiving the e-mails: bad input answered with the one error
 * shape naming the field, throttled sign-in, password reset (single use,
 * expiring), invitation acceptance (sign-up / sign-in / current session,
 * single use, expiry, existing member refused), tampered session cookie,
 * and lucia's session renewal.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resetDatabase, closeDatabase } from '@/test/helpers/db';
import {
  call,
  cookiePair,
  errorOf,
  makeUser,
  setupCallers,
  TEST_PASSWORD,
  type AuthzWorld,
  type Caller,
} from '@/test/helpers/authz';
import { startCatcher, type Catcher } from '@/src/mail/catcher';
import { getMail, listMail } from '@/db/repo/mail';
import { createInvitation, createNetwork, getMembership, listOpenInvitations } from '@/db/repo/networks';
import { getUserById, insertPasswordReset, resetTimesSince } from '@/db/repo/users';
import { requestPasswordReset } from '@/src/auth/accounts';
import { backgroundIdle } from '@/src/server/background';
import { inviteMember } from '@/src/auth/networks';
import { getSql } from '@/db/client';
import { hashToken, newToken } from '@/src/auth/tokens';
import * as signUp from '@/app/api/auth/sign-up/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as signOut from '@/app/api/auth/sign-out/route';
import * as session from '@/app/api/auth/session/route';
import * as resetReq from '@/app/api/auth/password-reset/route';
import * as resetConfirm from '@/app/api/auth/password-reset/confirm/route';
import * as passwordChange from '@/app/api/auth/password/route';
import * as networks from '@/app/api/networks/route';
import * as member from '@/app/api/networks/[networkId]/members/[userId]/route';
import * as invitations from '@/app/api/networks/[networkId]/invitations/route';
import * as invitationView from '@/app/api/invitations/[token]/route';
import * as accept from '@/app/api/invitations/[token]/accept/route';

let w: AuthzWorld;
let catcher: Catcher;
const anon: Caller = { name: 'anonymous', userId: null, email: null, cookie: null };
const post = (body: unknown) => ({ method: 'POST', body });

async function mailLinkTo(address: string, pathPart: string): Promise<string> {
  for (let i = 0; i < 50; i++) {
    const [latest] = await listMail({ to: address, limit: 1 });
    if (latest) {
      const m = await getMail(latest.id);
      const link = m?.text?.match(new RegExp(`https?://\\S*${pathPart}\\S*`))?.[0];
      if (link) return link;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail with ${pathPart} for ${address}`);
}

beforeAll(async () => {
  await resetDatabase();
  catcher = await startCatcher({ port: 0 });
  process.env.SMTP_HOST = '127.0.0.1';
  process.env.SMTP_PORT = String(catcher.port);
  process.env.APP_URL = 'http://cavitas.test';
  w = await setupCallers('flows');
});
afterAll(async () => {
  await catcher?.close();
  await closeDatabase();
});

describe('sign-up and sign-in', () => {
  it('answers sign-up the same for a new and a taken address; the taken one mails its owner and changes nothing', async () => {
    const fresh = `fresh.${Date.now()}@example.org`;
    const owner = w.callers.owner.email!;
    const before = await getUserById(w.callers.owner.userId!);
    const created = await call(signUp.POST, anon, post({ email: fresh, name: 'Fresh', password: 'long-enough-pass' }));
    const taken = await call(signUp.POST, anon, post({ email: owner.toUpperCase(), name: 'Twin', password: 'long-enough-pass' }));
    expect(created.status).toBe(202);
    expect(taken.status).toBe(202);
    expect(await taken.json()).toEqual(await created.json());
    expect(created.headers.get('set-cookie')).toBeNull(); // no session from sign-up itself
    expect(taken.headers.get('set-cookie')).toBeNull();
    await backgroundIdle();
    const notice = await mailLinkTo(owner, '/forgot-password');
    expect(notice).toBe('http://cavitas.test/forgot-password');
    const [latest] = await listMail({ to: owner, limit: 1 });
    expect(latest.subject).toMatch(/tried to create an account with your address/);
    const after = await getUserById(w.callers.owner.userId!);
    expect(after).toEqual(before); // name and password untouched
    // The new account signs in with the password it chose; the twin's password does not open the owner's.
    expect((await call(signIn.POST, anon, post({ email: fresh, password: 'long-enough-pass' }))).status).toBe(200);
    expect((await call(signIn.POST, anon, post({ email: owner, password: 'long-enough-pass' }))).status).toBe(401);
  });

  it('refuses a password under 10 characters with 400 naming the field', async () => {
    const res = await call(signUp.POST, anon, post({ email: 'short.pw@example.org', name: 'Shorty', password: '123456789' }));
    expect(res.status).toBe(400);
    const err = await errorOf(res);
    expect(err).toMatchObject({ code: 'invalid_input', field: 'password' });
    expect(err.message).toMatch(/10 characters/);
  });

  it('refuses a malformed address and a body that is not JSON', async () => {
    const bad = await call(signUp.POST, anon, post({ email: 'no-at-sign', name: 'X', password: 'long-enough-pass' }));
    expect([bad.status, (await errorOf(bad)).field]).toEqual([400, 'email']);
    const notJson = await call(signUp.POST, anon, { method: 'POST', rawBody: '{"email": ' });
    expect(notJson.status).toBe(400);
    expect((await errorOf(notJson)).message).toMatch(/not valid JSON/);
  });

  it('sets an httpOnly, SameSite=Lax session cookie, Secure unless COOKIE_SECURE=false', async () => {
    const res = await call(signIn.POST, anon, post({ email: w.callers.analyst.email, password: TEST_PASSWORD }));
    expect(res.status).toBe(200);
    const c = res.headers.get('set-cookie')!;
    expect(c).toMatch(/^cavitas_session=/);
    expect(c).toMatch(/HttpOnly/i);
    expect(c).toMatch(/SameSite=Lax/i);
    // tests run with NODE_ENV=test: not production, so no Secure flag (plain-http loopback works)
    expect(c).not.toMatch(/Secure/i);
  });

  it('throttles after five failures for an account with a 429 giving the wait', async () => {
    const u = await makeUser('Throttled', 'flows');
    for (let i = 0; i < 5; i++) {
      const r = await call(signIn.POST, anon, post({ email: u.email, password: 'wrong-password-x' }));
      expect(r.status).toBe(401);
    }
    const locked = await call(signIn.POST, anon, post({ email: u.email, password: TEST_PASSWORD }));
    expect(locked.status).toBe(429);
    expect(locked.headers.get('retry-after')).toMatch(/^\d+$/);
    expect((await errorOf(locked)).message).toMatch(/Try again in \d+ seconds/);
  });

  it('treats a tampered session cookie as signed out and clears it', async () => {
    const tampered: Caller = { ...w.callers.viewer, cookie: w.callers.viewer.cookie!.slice(0, -2) + 'zz' };
    const res = await call(networks.GET, tampered);
    expect(res.status).toBe(401);
    expect((await errorOf(res)).code).toBe('unauthorized');
    expect(res.headers.get('set-cookie')).toMatch(/cavitas_session=;.*Max-Age=0/i);
  });

  it('renews a session past half its 30-day life (lucia fresh session) with a new cookie', async () => {
    const u = await makeUser('Renewing', 'flows');
    const sid = u.cookie.split('=')[1];
    await getSql()`update sessions set expires_at = now() + interval '10 days' where id = ${sid}`;
    const res = await call(session.GET, u);
    expect((await res.json()).user.email).toBe(u.email);
    expect(res.headers.get('set-cookie')).toMatch(/cavitas_session=/);
    const [row] = await getSql()`select extract(epoch from expires_at - now()) / 86400 as days from sessions where id = ${sid}`;
    expect(Number(row.days)).toBeGreaterThan(29.9);
  });

  it('an expired session counts as signed out', async () => {
    const u = await makeUser('Expired', 'flows');
    const sid = u.cookie.split('=')[1];
    await getSql()`update sessions set expires_at = now() - interval '1 minute' where id = ${sid}`;
    expect((await call(networks.GET, u)).status).toBe(401);
  });

  it('signing out ends the session on the server', async () => {
    const u = await makeUser('Leaving', 'flows');
    expect((await call(signOut.POST, u, { method: 'POST' })).status).toBe(200);
    expect((await call(networks.GET, u)).status).toBe(401);
  });
});

describe('password reset', () => {
  it('mails a single-use link; the new password works, old sessions end', async () => {
    const u = await makeUser('Forgetful', 'flows');
    expect((await call(resetReq.POST, anon, post({ email: u.email }))).status).toBe(202);
    const link = await mailLinkTo(u.email, '/reset-password');
    expect(link.startsWith('http://cavitas.test/reset-password?token=')).toBe(true);
    const token = decodeURIComponent(new URL(link).searchParams.get('token')!);
    const ok = await call(resetConfirm.POST, anon, post({ token, password: 'a-brand-new-secret' }));
    expect(ok.status).toBe(200);
    expect((await call(networks.GET, u)).status).toBe(401);
    expect((await call(signIn.POST, anon, post({ email: u.email, password: 'a-brand-new-secret' }))).status).toBe(200);
    const again = await call(resetConfirm.POST, anon, post({ token, password: 'another-new-secret' }));
    expect(again.status).toBe(404);
  });

  it('a new link retires the older ones, and a completed reset retires every link', async () => {
    const u = await makeUser('Twice', 'flows');
    const tokens = [newToken(), newToken(), newToken()];
    const inHour = () => new Date(Date.now() + 3_600_000);
    await insertPasswordReset(u.userId, hashToken(tokens[0]), inHour());
    await insertPasswordReset(u.userId, hashToken(tokens[1]), inHour());
    const old = await call(resetConfirm.POST, anon, post({ token: tokens[0], password: 'first-new-secret' }));
    expect(old.status).toBe(404); // superseded by the second link
    // A link stored by hand beside the newest (as by two racing requests) is retired by the reset itself.
    await getSql()`insert into password_resets (token_hash, user_id, expires_at) values (${hashToken(tokens[2])}, ${u.userId}, now() + interval '1 hour')`;
    expect((await call(resetConfirm.POST, anon, post({ token: tokens[1], password: 'second-new-secret' }))).status).toBe(200);
    expect((await call(resetConfirm.POST, anon, post({ token: tokens[2], password: 'third-new-secret' }))).status).toBe(404);
    expect((await call(signIn.POST, anon, post({ email: u.email, password: 'second-new-secret' }))).status).toBe(200);
  });

  it('an expired link is refused with 410', async () => {
    const u = await makeUser('Late', 'flows');
    const token = newToken();
    await insertPasswordReset(u.userId, hashToken(token), new Date(Date.now() - 1000));
    const res = await call(resetConfirm.POST, anon, post({ token, password: 'a-brand-new-secret' }));
    expect(res.status).toBe(410);
    expect((await errorOf(res)).message).toMatch(/expired/);
  });

  it('mails at most three links to one account within an hour, answering the same each time', async () => {
    const u = await makeUser('Flooded', 'flows');
    const later = new Date(Date.now() + 24 * 3_600_000); // a quiet hour of its own
    const mails = async () => (await listMail({ to: u.email, limit: 50 })).length;
    const before = await mails();
    for (let i = 0; i < 5; i++) {
      await requestPasswordReset(u.email, 'http://cavitas.test', new Date(later.getTime() + i * 60_000));
      await backgroundIdle();
    }
    expect(await resetTimesSince(u.userId, later)).toHaveLength(3);
    for (let i = 0; i < 50 && (await mails()) < before + 3; i++) await new Promise((r) => setTimeout(r, 100));
    expect(await mails()).toBe(before + 3);
    // An hour after the first, one more may go.
    await requestPasswordReset(u.email, 'http://cavitas.test', new Date(later.getTime() + 61 * 60_000));
    await backgroundIdle();
    expect(await resetTimesSince(u.userId, later)).toHaveLength(4);
    // Through the route the answer does not change when a request is dropped.
    expect((await call(resetReq.POST, anon, post({ email: u.email }))).status).toBe(202);
  });

  it('answers the same for an address without an account', async () => {
    const res = await call(resetReq.POST, anon, post({ email: 'nobody.here@example.org' }));
    expect(res.status).toBe(202);
  });
});

describe('password change', () => {
  it('checks the current password, keeps the session asking and ends every other one', async () => {
    const u = await makeUser('Changer', 'flows');
    const second = await call(signIn.POST, anon, post({ email: u.email, password: TEST_PASSWORD }));
    const elsewhere: Caller = { ...u, cookie: cookiePair(second.headers.get('set-cookie')!) };
    expect((await call(networks.GET, elsewhere)).status).toBe(200);
    const wrong = await call(
      passwordChange.POST,
      u,
      post({ currentPassword: 'not-the-password', newPassword: 'fresh-secret-123' }),
    );
    expect(wrong.status).toBe(400);
    expect((await errorOf(wrong)).field).toBe('currentPassword');
    const ok = await call(passwordChange.POST, u, post({ currentPassword: TEST_PASSWORD, newPassword: 'fresh-secret-123' }));
    expect(ok.status).toBe(200);
    expect(await ok.json()).toEqual({ ok: true, otherSessionsEnded: 1 });
    expect((await call(networks.GET, u)).status).toBe(200); // this session stays
    expect((await call(networks.GET, elsewhere)).status).toBe(401); // the other one ended
    expect((await call(signIn.POST, anon, post({ email: u.email, password: TEST_PASSWORD }))).status).toBe(401);
    expect((await call(signIn.POST, anon, post({ email: u.email, password: 'fresh-secret-123' }))).status).toBe(200);
  });

  it('needs a session and a valid new password', async () => {
    const body = post({ currentPassword: TEST_PASSWORD, newPassword: 'fresh-secret-123' });
    expect((await call(passwordChange.POST, anon, body)).status).toBe(401);
    const u = await makeUser('Short', 'flows');
    const short = await call(passwordChange.POST, u, post({ currentPassword: TEST_PASSWORD, newPassword: 'short' }));
    expect([short.status, (await errorOf(short)).field]).toEqual([400, 'newPassword']);
  });
});

describe('networks and members', () => {
  it('refuses an empty and a 200-character network name', async () => {
    const empty = await call(networks.POST, w.callers.owner, post({ name: '   ' }));
    expect([empty.status, (await errorOf(empty)).field]).toEqual([400, 'name']);
    const long = await call(networks.POST, w.callers.owner, post({ name: 'x'.repeat(200) }));
    const err = await errorOf(long);
    expect([long.status, err.field]).toEqual([400, 'name']);
    expect(err.message).toMatch(/120 characters/);
  });

  it('trims the name and accepts exactly 120 characters', async () => {
    const res = await call(networks.POST, w.callers.owner, post({ name: `  ${'y'.repeat(120)}  ` }));
    expect(res.status).toBe(201);
    expect((await res.json()).network.name).toBe('y'.repeat(120));
  });

  it('the last owner can be neither demoted nor removed', async () => {
    const p = { networkId: w.networkId, userId: w.callers.owner.userId! };
    const demote = await call(member.PATCH, w.callers.owner, { method: 'PATCH', body: { role: 'viewer' }, params: p });
    expect(demote.status).toBe(409);
    expect((await errorOf(demote)).message).toMatch(/at least one owner/);
    const remove = await call(member.DELETE, w.callers.owner, { method: 'DELETE', params: p });
    expect(remove.status).toBe(409);
    expect((await getMembership(w.networkId, w.callers.owner.userId!))?.role).toBe('owner');
  });

  it('refuses an unknown role with a message listing the roles', async () => {
    const res = await call(member.PATCH, w.callers.owner, {
      method: 'PATCH',
      body: { role: 'admin' },
      params: { networkId: w.networkId, userId: w.callers.viewer.userId! },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toMatch(/owner, analyst or viewer/);
  });
});

describe('invitations', () => {
  const invite = (email: string, role = 'analyst') =>
    call(invitations.POST, w.callers.owner, { method: 'POST', body: { email, role }, params: { networkId: w.networkId } });

  it("refuses a sender's 21st invitation within an hour with 429 and the wait", async () => {
    const sender = await makeUser('Busy', 'flows');
    const net = await createNetwork('Busy network flows', sender.userId);
    const user = (await getUserById(sender.userId))!;
    const later = new Date(Date.now() + 48 * 3_600_000);
    for (let i = 0; i < 20; i++) {
      await inviteMember(
        net.id,
        net.name,
        user,
        { email: `guest${i}.busy@example.org`, role: 'viewer' },
        'http://cavitas.test',
        new Date(later.getTime() + i * 1000),
      );
    }
    const refused = await inviteMember(
      net.id,
      net.name,
      user,
      { email: 'one.more@example.org', role: 'viewer' },
      'http://cavitas.test',
      new Date(later.getTime() + 30 * 60_000),
    ).then(
      () => null,
      (e: { status: number; message: string }) => e,
    );
    expect(refused?.status).toBe(429);
    expect(refused?.message).toMatch(/20 invitations within the last hour\. Try again in 30 minutes/);
    // Nothing was stored for the refused one.
    expect((await listOpenInvitations(net.id, later)).map((r) => r.email)).not.toContain('one.more@example.org');
  });

  it('refuses to invite an existing member, naming the address', async () => {
    const res = await invite(w.callers.viewer.email!.toUpperCase());
    expect(res.status).toBe(409);
    const err = await errorOf(res);
    expect(err.field).toBe('email');
    expect(err.message).toMatch(/already a member/);
  });

  it('new colleague: mail → view → sign up and join with the invited role, once', async () => {
    const email = 'colleague.new@example.org';
    const res = await invite(email, 'analyst');
    expect(res.status).toBe(201);
    expect((await res.json()).mailSent).toBe(true);
    const link = await mailLinkTo(email, '/invitations/');
    const token = decodeURIComponent(link.split('/invitations/')[1]);
    const view = await call(invitationView.GET, anon, { params: { token } });
    expect((await view.json()).invitation).toMatchObject({ email, role: 'analyst', hasAccount: false });

    const joined = await call(accept.POST, anon, {
      method: 'POST',
      body: { mode: 'sign-up', name: 'New Colleague', password: 'colleague-pass-1' },
      params: { token },
    });
    expect(joined.status).toBe(200);
    expect(await joined.json()).toMatchObject({ networkId: w.networkId, role: 'analyst' });
    const cookie = cookiePair(joined.headers.get('set-cookie')!);
    const me = await (await call(session.GET, { ...anon, cookie })).json();
    expect((await getMembership(w.networkId, me.user.id))?.role).toBe('analyst');

    const reused = await call(accept.POST, anon, {
      method: 'POST',
      body: { mode: 'sign-up', name: 'Again', password: 'colleague-pass-1' },
      params: { token },
    });
    expect(reused.status).toBe(410);
    expect((await errorOf(reused)).message).toMatch(/already been used/);
  });

  it('existing account: signs in with the invited address and joins', async () => {
    const outsider = await makeUser('Outsider', 'flows');
    const res = await invite(outsider.email, 'viewer');
    const { link } = await res.json();
    const token = decodeURIComponent(link.split('/invitations/')[1]);
    const wrong = await call(accept.POST, anon, {
      method: 'POST',
      body: { mode: 'sign-in', password: 'not-the-password' },
      params: { token },
    });
    expect(wrong.status).toBe(401);
    const ok = await call(accept.POST, anon, {
      method: 'POST',
      body: { mode: 'sign-in', password: TEST_PASSWORD },
      params: { token },
    });
    expect(ok.status).toBe(200);
    expect((await getMembership(w.networkId, outsider.userId))?.role).toBe('viewer');
  });

  it('signed in with another address: 403 and nothing joined', async () => {
    const res = await invite('someone.else@example.org', 'viewer');
    const { link } = await res.json();
    const token = decodeURIComponent(link.split('/invitations/')[1]);
    const other = await call(accept.POST, w.callers.otherOwner, { method: 'POST', body: { mode: 'current' }, params: { token } });
    expect(other.status).toBe(403);
    expect((await errorOf(other)).message).toMatch(/someone\.else@example\.org/);
    expect(await getMembership(w.networkId, w.callers.otherOwner.userId!)).toBeNull();
    const anonymous = await call(accept.POST, anon, { method: 'POST', body: { mode: 'current' }, params: { token } });
    expect(anonymous.status).toBe(401);
  });

  it('sign-up acceptance that fails (address taken meanwhile) rolls back: invitation stays open', async () => {
    const email = 'race.taken@example.org';
    const res = await invite(email, 'viewer');
    const { link } = await res.json();
    const token = decodeURIComponent(link.split('/invitations/')[1]);
    await call(signUp.POST, anon, post({ email, name: 'Early Bird', password: 'early-bird-pass' }));
    const r = await call(accept.POST, anon, {
      method: 'POST',
      body: { mode: 'sign-up', name: 'Late', password: 'late-pass-123' },
      params: { token },
    });
    expect(r.status).toBe(409);
    expect((await call(invitationView.GET, anon, { params: { token } })).status).toBe(200);
  });

  it('unknown token is 404, expired is 410, each with a message', async () => {
    const unknown = await call(invitationView.GET, anon, { params: { token: 'no-such-token-at-all' } });
    expect(unknown.status).toBe(404);
    expect((await errorOf(unknown)).message).toMatch(/unknown/);
    const token = newToken();
    await createInvitation({
      networkId: w.networkId,
      email: 'too.late@example.org',
      role: 'viewer',
      tokenHash: hashToken(token),
      invitedBy: w.callers.owner.userId!,
      expiresAt: new Date(Date.now() - 60_000),
    });
    const expired = await call(accept.POST, anon, {
      method: 'POST',
      body: { mode: 'sign-up', name: 'Late', password: 'late-pass-123' },
      params: { token },
    });
    expect(expired.status).toBe(410);
    expect((await errorOf(expired)).message).toMatch(/expired/);
  });

  it('invitations expire seven days after sending', async () => {
    const before = Date.now();
    const res = await invite('week.check@example.org', 'viewer');
    const { invitation } = await res.json();
    const days = (new Date(invitation.expiresAt).getTime() - before) / 86_400_000;
    expect(days).toBeGreaterThan(6.999);
    expect(days).toBeLessThan(7.001);
  });
});
