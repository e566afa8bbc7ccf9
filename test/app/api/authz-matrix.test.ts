/**
 * Authorization matrix for the account, network, member and invitation API:
 * every route × every caller (anonymous, viewer, analyst, owner, owner of
 * another network) against the exact expected status. Role rules follow the
 * permission table in src/auth/permissions.ts; the 404-for-non-members rule
 * keeps other networks' ids from being confirmed (common practice, OWASP
 * "Insecure Direct Object Reference" guidance).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resetDatabase, closeDatabase } from '@/test/helpers/db';
import {
  CALLERS,
  call,
  cookiePair,
  errorOf,
  makeUser,
  setupCallers,
  type AuthzWorld,
  type CallerName,
} from '@/test/helpers/authz';
import { upsertMembership, createInvitation, getMembership } from '@/db/repo/networks';
import { hashToken, newToken } from '@/src/auth/tokens';
import * as networksRoute from '@/app/api/networks/route';
import * as networkRoute from '@/app/api/networks/[networkId]/route';
import * as membersRoute from '@/app/api/networks/[networkId]/members/route';
import * as memberRoute from '@/app/api/networks/[networkId]/members/[userId]/route';
import * as invitationsRoute from '@/app/api/networks/[networkId]/invitations/route';
import * as invitationRoute from '@/app/api/networks/[networkId]/invitations/[invitationId]/route';
import * as sessionRoute from '@/app/api/auth/session/route';
import * as signUpRoute from '@/app/api/auth/sign-up/route';
import * as signInRoute from '@/app/api/auth/sign-in/route';
import * as resetRoute from '@/app/api/auth/password-reset/route';
import * as publicInvitationRoute from '@/app/api/invitations/[token]/route';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as signOutRoute from '@/app/api/auth/sign-out/route';
import * as resetConfirmRoute from '@/app/api/auth/password-reset/confirm/route';
import { startSession } from '@/src/auth/session';
import { startCatcher, type Catcher } from '@/src/mail/catcher';

let w: AuthzWorld;
let catcher: Catcher;
let seq = 0;
const uniq = () => `${Date.now().toString(36)}${(seq++).toString(36)}`;

beforeAll(async () => {
  await resetDatabase();
  catcher = await startCatcher({ port: 0 });
  process.env.SMTP_HOST = '127.0.0.1';
  process.env.SMTP_PORT = String(catcher.port);
  w = await setupCallers('matrix');
});
afterAll(async () => {
  await catcher?.close();
  await closeDatabase();
});

type Row = {
  name: string;
  /** Expected status for anonymous, viewer, analyst, owner, otherOwner. */
  expect: [number, number, number, number, number];
  run: (caller: CallerName) => Promise<Response>;
};

async function freshMember(): Promise<string> {
  const m = await makeUser('Extra', uniq());
  await upsertMembership(w.networkId, m.userId, 'viewer');
  return m.userId;
}

async function freshInvitation(): Promise<string> {
  const inv = await createInvitation({
    networkId: w.networkId,
    email: `pending.${uniq()}@example.org`,
    role: 'viewer',
    tokenHash: hashToken(newToken()),
    invitedBy: w.callers.owner.userId!,
    expiresAt: new Date(Date.now() + 86_400_000),
  });
  return inv.id;
}

const rows: Row[] = [
  {
    name: 'GET /api/networks',
    expect: [401, 200, 200, 200, 200],
    run: (c) => call(networksRoute.GET, w.callers[c], { path: '/api/networks' }),
  },
  {
    name: 'POST /api/networks',
    expect: [401, 201, 201, 201, 201],
    run: (c) => call(networksRoute.POST, w.callers[c], { method: 'POST', path: '/api/networks', body: { name: `Made by ${c}` } }),
  },
  {
    name: 'GET /api/networks/:id',
    expect: [401, 200, 200, 200, 404],
    run: (c) => call(networkRoute.GET, w.callers[c], { params: { networkId: w.networkId } }),
  },
  {
    name: 'PATCH /api/networks/:id',
    expect: [401, 403, 403, 200, 404],
    run: (c) =>
      call(networkRoute.PATCH, w.callers[c], {
        method: 'PATCH',
        body: { name: 'Test network matrix' },
        params: { networkId: w.networkId },
      }),
  },
  {
    name: 'GET /api/networks/:id/members',
    expect: [401, 200, 200, 200, 404],
    run: (c) => call(membersRoute.GET, w.callers[c], { params: { networkId: w.networkId } }),
  },
  {
    name: 'PATCH /api/networks/:id/members/:userId',
    expect: [401, 403, 403, 200, 404],
    run: async (c) =>
      call(memberRoute.PATCH, w.callers[c], {
        method: 'PATCH',
        body: { role: 'analyst' },
        params: { networkId: w.networkId, userId: await freshMember() },
      }),
  },
  {
    name: 'DELETE /api/networks/:id/members/:userId',
    expect: [401, 403, 403, 200, 404],
    run: async (c) =>
      call(memberRoute.DELETE, w.callers[c], {
        method: 'DELETE',
        params: { networkId: w.networkId, userId: await freshMember() },
      }),
  },
  {
    name: 'GET /api/networks/:id/invitations',
    expect: [401, 403, 403, 200, 404],
    run: (c) => call(invitationsRoute.GET, w.callers[c], { params: { networkId: w.networkId } }),
  },
  {
    name: 'POST /api/networks/:id/invitations',
    expect: [401, 403, 403, 201, 404],
    run: (c) =>
      call(invitationsRoute.POST, w.callers[c], {
        method: 'POST',
        body: { email: `new.${uniq()}@example.org`, role: 'viewer' },
        params: { networkId: w.networkId },
      }),
  },
  {
    name: 'DELETE /api/networks/:id/invitations/:invitationId',
    expect: [401, 403, 403, 200, 404],
    run: async (c) =>
      call(invitationRoute.DELETE, w.callers[c], {
        method: 'DELETE',
        params: { networkId: w.networkId, invitationId: await freshInvitation() },
      }),
  },
  { name: 'GET /api/auth/session', expect: [200, 200, 200, 200, 200], run: (c) => call(sessionRoute.GET, w.callers[c]) },
  {
    name: 'POST /api/auth/sign-up',
    expect: [202, 202, 202, 202, 202],
    run: (c) =>
      call(signUpRoute.POST, w.callers[c], {
        method: 'POST',
        body: { email: `signup.${uniq()}@example.org`, name: 'New Person', password: 'long-enough-pass' },
      }),
  },
  {
    name: 'POST /api/auth/sign-in (right password)',
    expect: [200, 200, 200, 200, 200],
    run: (c) =>
      call(signInRoute.POST, w.callers[c], { method: 'POST', body: { email: w.callers.owner.email, password: w.password } }),
  },
  {
    name: 'POST /api/auth/password-reset',
    expect: [202, 202, 202, 202, 202],
    run: (c) => call(resetRoute.POST, w.callers[c], { method: 'POST', body: { email: w.callers.viewer.email } }),
  },
  {
    name: 'GET /api/invitations/:token (valid token)',
    expect: [200, 200, 200, 200, 200],
    run: async (c) => {
      const token = newToken();
      await createInvitation({
        networkId: w.networkId,
        email: `look.${uniq()}@example.org`,
        role: 'analyst',
        tokenHash: hashToken(token),
        invitedBy: w.callers.owner.userId!,
        expiresAt: new Date(Date.now() + 86_400_000),
      });
      return call(publicInvitationRoute.GET, w.callers[c], { params: { token } });
    },
  },
  {
    name: 'POST /api/invitations/:token/accept (mode current, invitation to someone else)',
    expect: [401, 403, 403, 403, 403],
    run: async (c) => {
      const token = newToken();
      await createInvitation({
        networkId: w.networkId,
        email: `stranger.${uniq()}@example.org`,
        role: 'viewer',
        tokenHash: hashToken(token),
        invitedBy: w.callers.owner.userId!,
        expiresAt: new Date(Date.now() + 86_400_000),
      });
      return call(acceptRoute.POST, w.callers[c], { method: 'POST', body: { mode: 'current' }, params: { token } });
    },
  },
  {
    name: 'POST /api/auth/password-reset/confirm (unknown token)',
    expect: [404, 404, 404, 404, 404],
    run: (c) =>
      call(resetConfirmRoute.POST, w.callers[c], {
        method: 'POST',
        body: { token: 'unknown-token-value', password: 'long-enough-pass' },
      }),
  },
  {
    name: 'POST /api/auth/sign-out (on a second session of the caller)',
    expect: [200, 200, 200, 200, 200],
    run: async (c) => {
      const who = w.callers[c];
      const cookie = who.userId ? cookiePair(await startSession(who.userId)) : null;
      return call(signOutRoute.POST, { ...who, cookie }, { method: 'POST' });
    },
  },
];

describe('authorization matrix', () => {
  for (const row of rows) {
    it(row.name, async () => {
      const got: Record<string, number> = {};
      const want: Record<string, number> = {};
      for (const [i, c] of CALLERS.entries()) {
        const res = await row.run(c);
        got[c] = res.status;
        want[c] = row.expect[i];
        if (res.status >= 400) {
          const err = await errorOf(res);
          expect(err.code, `${row.name} as ${c}`).toMatch(/^[a-z_]+$/);
          expect(err.message.length, `${row.name} as ${c}`).toBeGreaterThan(10);
          expect(JSON.stringify(err)).not.toMatch(/\bat .+\.(ts|js):\d+/); // no stack traces
        }
      }
      expect(got).toEqual(want);
    });
  }

  it('a denied role change leaves the membership as it was', async () => {
    const target = await freshMember();
    for (const c of ['viewer', 'analyst', 'otherOwner'] as const) {
      await call(memberRoute.PATCH, w.callers[c], {
        method: 'PATCH',
        body: { role: 'owner' },
        params: { networkId: w.networkId, userId: target },
      });
      await call(memberRoute.DELETE, w.callers[c], { method: 'DELETE', params: { networkId: w.networkId, userId: target } });
    }
    expect((await getMembership(w.networkId, target))?.role).toBe('viewer');
  });

  it('the other network’s owner gets the same 404 for a real and a made-up network id', async () => {
    const real = await call(networkRoute.GET, w.callers.otherOwner, { params: { networkId: w.networkId } });
    const fake = await call(networkRoute.GET, w.callers.otherOwner, {
      params: { networkId: '00000000-0000-4000-8000-000000000000' },
    });
    expect([real.status, fake.status]).toEqual([404, 404]);
    expect(await errorOf(real)).toEqual(await errorOf(fake));
  });
});
