/**
 * Read-only run links: the role matrix of the link routes (viewers read the
 * list but cannot create or revoke; other networks get 404, common practice:
 * foreign ids are not confirmed), the contract `POST … {expiresInDays}` → 201
 * `{id, url}`, and what a link opens without signing in: its run's page and
 * API while it stands, a plain page with status 410 once revoked or expired
 * (RFC 9110 §15.5.11: gone, and no forwarding address), 404 when tampered.
 * Signatures are checked against Python's hmac module (RFC 2104, HMAC-SHA256).
 */
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call, errorOf, type CallerName } from '@/test/helpers/authz';
import { insertRunLink } from '@/db/repo/sharing';
import { signLinkToken, verifyLinkToken } from '@/src/sharing/tokens';
import { linkSecret } from '@/src/sharing/secret';
import * as linksRoute from '@/app/api/networks/[networkId]/runs/[runId]/links/route';
import * as linkRoute from '@/app/api/networks/[networkId]/runs/[runId]/links/[linkId]/route';
import * as sharedRoute from '@/app/shared/[token]/route';
import * as sharedApi from '@/app/api/shared/[token]/route';
import * as sharedFits from '@/app/api/shared/[token]/fits/route';
import { makeSharingWorld, type SharingWorld } from './world';

let w: SharingWorld;
const R = () => ({ networkId: w.networkId, runId: w.runId });
const tokenOf = (url: string) => new URL(url).pathname.split('/')[2];

async function newLink(caller: CallerName = 'analyst', expiresInDays = 3) {
  const res = await call(linksRoute.POST, w.callers[caller], { method: 'POST', params: R(), body: { expiresInDays } });
  expect(res.status).toBe(201);
  return (await res.json()) as { id: string; url: string };
}
async function openShared(token: string) {
  return call(sharedRoute.GET, null, { params: { token } });
}

beforeAll(async () => {
  await resetDatabase();
  w = await makeSharingWorld('links');
});
afterAll(() => closeQueueAndDatabase());

describe('link routes: who may do what', () => {
  const rows: { name: string; expect: number[]; run: (c: CallerName) => Promise<Response> }[] = [
    { name: 'GET links', expect: [401, 200, 200, 200, 404], run: (c) => call(linksRoute.GET, w.callers[c], { params: R() }) },
    {
      name: 'POST links',
      expect: [401, 403, 201, 201, 404],
      run: (c) => call(linksRoute.POST, w.callers[c], { method: 'POST', params: R(), body: { expiresInDays: 2 } }),
    },
    {
      name: 'DELETE link',
      expect: [401, 403, 200, 200, 404],
      run: async (c) =>
        call(linkRoute.DELETE, w.callers[c], { method: 'DELETE', params: { ...R(), linkId: (await newLink('owner')).id } }),
    },
  ];
  for (const row of rows)
    it(`${row.name}: anonymous, viewer, analyst, owner, other network → ${row.expect.join(', ')}`, async () => {
      const got: number[] = [];
      for (const c of CALLERS) got.push((await row.run(c)).status);
      expect(got).toEqual(row.expect);
    });

  it('the list names the creator and the time; only those who may share see the URLs', async () => {
    const made = await newLink('analyst', 5);
    const asViewer = (await (await call(linksRoute.GET, w.callers.viewer, { params: R() })).json()) as {
      links: { id: string; url?: string; createdBy: string; createdAt: string; state: string; expiresAt: string }[];
    };
    const seen = asViewer.links.find((l) => l.id === made.id)!;
    expect(seen.createdBy).toBe('Analyst links');
    expect(seen.state).toBe('active');
    expect(seen.url).toBeUndefined();
    expect(Math.abs(Date.parse(seen.createdAt) - Date.now())).toBeLessThan(60_000);
    expect(Date.parse(seen.expiresAt) - Date.parse(seen.createdAt)).toBeGreaterThan(5 * 86_400_000 - 2000);
    const asOwner = (await (await call(linksRoute.GET, w.callers.owner, { params: R() })).json()) as {
      links: { id: string; url?: string }[];
    };
    expect(asOwner.links.find((l) => l.id === made.id)!.url).toBe(made.url);
  });

  it('refuses a bad expiry with the field named, and a run of another network', async () => {
    for (const expiresInDays of [0, 1.5, 400, 'soon']) {
      const res = await call(linksRoute.POST, w.callers.owner, { method: 'POST', params: R(), body: { expiresInDays } });
      expect(res.status).toBe(400);
      expect((await errorOf(res)).field).toBe('expiresInDays');
    }
    const foreign = await call(linksRoute.POST, w.callers.otherOwner, {
      method: 'POST',
      params: { networkId: w.otherNetworkId, runId: w.runId },
      body: { expiresInDays: 1 },
    });
    expect(foreign.status).toBe(404);
  });
});

describe('what a link opens', () => {
  it('a standing link goes to its run’s read-only page, and its API answers for that run only', async () => {
    const { url } = await newLink();
    expect(new URL(url).pathname).toMatch(/^\/shared\/[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+$/);
    const token = tokenOf(url);
    const res = await openShared(token);
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`/shared/${token}/run`);
    const view = await call(sharedApi.GET, null, { params: { token } });
    expect(view.status).toBe(200);
    const body = (await view.json()) as { run: { id: string }; intervals: { startsAt: string }[] };
    expect(body.run.id).toBe(w.runId);
    const fits = await call(sharedFits.GET, null, {
      params: { token },
      path: `/x?interval=${encodeURIComponent(w.intervals[0])}&minimum=0`,
    });
    expect(fits.status).toBe(200);
    expect(((await fits.json()) as { series: unknown[] }).series.length).toBe(6);
  });

  it('a revoked link answers 410 with a page that says so, and its API 410', async () => {
    const { id, url } = await newLink();
    const token = tokenOf(url);
    const del = await call(linkRoute.DELETE, w.callers.owner, { method: 'DELETE', params: { ...R(), linkId: id } });
    expect(del.status).toBe(200);
    const res = await openShared(token);
    expect(res.status).toBe(410);
    expect(res.headers.get('content-type')).toMatch(/text\/html/);
    expect(await res.text()).toMatch(/withdrawn/);
    expect((await call(sharedApi.GET, null, { params: { token } })).status).toBe(410);
    const list = (await (await call(linksRoute.GET, w.callers.owner, { params: R() })).json()) as {
      links: { id: string; state: string; revokedBy: string }[];
    };
    expect(list.links.find((l) => l.id === id)).toMatchObject({ state: 'revoked', revokedBy: 'Owner links' });
  });

  it('an expired link answers 410', async () => {
    const row = await insertRunLink({
      networkId: w.networkId,
      runId: w.runId,
      createdBy: w.callers.owner.userId!,
      expiresAt: new Date(Math.floor(Date.now() / 1000) * 1000 - 1000),
    });
    const token = signLinkToken({ linkId: row.id, expiresAt: row.expiresAt }, await linkSecret());
    const res = await openShared(token);
    expect(res.status).toBe(410);
    expect(await res.text()).toMatch(/expired/);
  });

  it('a tampered token is refused (404) and opens nothing', async () => {
    const { url } = await newLink();
    const token = tokenOf(url);
    const [payload, sig] = token.split('.');
    const flipped = sig[0] === 'A' ? `B${sig.slice(1)}` : `A${sig.slice(1)}`;
    // a later expiry with the old signature, another signature, truncations and junk
    const later = Buffer.from(
      Buffer.from(payload, 'base64url')
        .toString()
        .replace(/:(\d+)$/, (_, s) => `:${Number(s) + 86400}`),
    ).toString('base64url');
    for (const bad of [`${payload}.${flipped}`, `${later}.${sig}`, payload, `${token}x`, 'x.y', '..', '%00']) {
      const res = await openShared(bad);
      expect(res.status, bad).toBe(404);
      expect(await res.text()).toMatch(/not valid/);
      expect((await call(sharedApi.GET, null, { params: { token: bad } })).status).toBe(404);
    }
  });
});

describe('token signatures', () => {
  it('are HMAC-SHA256 of the payload, as Python’s hmac module computes them (RFC 2104)', () => {
    const secret = 'a-test-secret-of-more-than-32-characters';
    const token = signLinkToken(
      { linkId: '0b7d2a0e-3f7c-4e3b-9a65-1c2d3e4f5a6b', expiresAt: new Date(1_900_000_000_000) },
      secret,
    );
    const [payload, sig] = token.split('.');
    const py = spawnSync(
      'python3',
      [
        '-c',
        'import hmac,hashlib,base64,sys;print(base64.urlsafe_b64encode(hmac.new(sys.argv[1].encode(),("cavitas-run-link-v1:"+sys.argv[2]).encode(),hashlib.sha256).digest()).decode().rstrip("="))',
        secret,
        payload,
      ],
      { encoding: 'utf8' },
    );
    expect(py.stdout.trim()).toBe(sig);
    expect(verifyLinkToken(token, secret)).toEqual({
      linkId: '0b7d2a0e-3f7c-4e3b-9a65-1c2d3e4f5a6b',
      expiresAt: new Date(1_900_000_000_000),
    });
    expect(verifyLinkToken(token, `${secret}!`)).toBeNull();
  });
});
