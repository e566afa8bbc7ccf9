/**
 * The audit trail with a real throwaway database: what members do through the
 * routes (share a run by link and withdraw it, comment, export a case file and
 * import it back, change a station, change a member's role, delete a run) is
 * recorded by the domain modules with who and when; only owners read the
 * trail (viewers and analysts 403, other networks 404, anonymous 401), as
 * JSON or CSV; a CSV cell that a spreadsheet would run as a formula is
 * written inert (OWASP "CSV Injection" — common practice).
 */
import { describe, expect, it } from 'vitest';
import { CALLERS, call, makeUser } from '@/test/helpers/authz';
import { upsertMembership } from '@/db/repo/networks';
import * as auditRoute from '@/app/api/networks/[networkId]/audit/route';
import * as commentsRoute from '@/app/api/networks/[networkId]/runs/[runId]/comments/route';
import * as linksRoute from '@/app/api/networks/[networkId]/runs/[runId]/links/route';
import * as linkRoute from '@/app/api/networks/[networkId]/runs/[runId]/links/[linkId]/route';
import * as exportRoute from '@/app/api/networks/[networkId]/runs/[runId]/export/route';
import * as importRoute from '@/app/api/networks/[networkId]/runs/import/route';
import * as runRoute from '@/app/api/networks/[networkId]/runs/[runId]/route';
import * as cancelRoute from '@/app/api/networks/[networkId]/runs/[runId]/cancel/route';
import * as stationRoute from '@/app/api/networks/[networkId]/stations/[stationId]/route';
import * as memberRoute from '@/app/api/networks/[networkId]/members/[userId]/route';
import type { AuditEntry } from '@/src/audit';
import { withSharingWorld } from '@/test/sharing/world';

const world = withSharingWorld('audit');
const N = () => ({ networkId: world().networkId });
const R = () => ({ networkId: world().networkId, runId: world().runId });

async function trail(): Promise<AuditEntry[]> {
  const res = await call(auditRoute.GET, world().callers.owner, { params: N() });
  expect(res.status).toBe(200);
  return ((await res.json()) as { entries: AuditEntry[] }).entries;
}

describe('audit trail', () => {
  it('only owners read it: anonymous, viewer, analyst, owner, other network → 401, 403, 403, 200, 404', async () => {
    for (const format of ['json', 'csv']) {
      const got: number[] = [];
      for (const c of CALLERS)
        got.push((await call(auditRoute.GET, world().callers[c], { params: N(), path: `/x?format=${format}` })).status);
      expect(got, format).toEqual([401, 403, 403, 200, 404]);
    }
    expect((await call(auditRoute.GET, world().callers.owner, { params: N(), path: '/x?format=xml' })).status).toBe(400);
  });

  it('records who shared, withdrew, commented, exported, imported, changed and deleted what', async () => {
    const analyst = world().callers.analyst;
    const owner = world().callers.owner;
    const made = await call(linksRoute.POST, analyst, { method: 'POST', params: R(), body: { expiresInDays: 2 } });
    expect(made.status).toBe(201);
    const link = (await made.json()) as { id: string };
    expect((await call(linkRoute.DELETE, analyst, { method: 'DELETE', params: { ...R(), linkId: link.id } })).status).toBe(200);
    const said = await call(commentsRoute.POST, world().callers.viewer, {
      method: 'POST',
      params: R(),
      body: { body: 'Looks right' },
    });
    expect(said.status).toBe(201);
    const exported = await call(exportRoute.GET, analyst, { params: R(), path: '/x?what=case' });
    expect(exported.status).toBe(200);
    const imported = await call(importRoute.POST, analyst, { method: 'POST', params: N(), body: await exported.json() });
    expect(imported.status).toBe(201);
    const { runId: newRun } = (await imported.json()) as { runId: string };
    const st = world().stations[0];
    const got = (await (await call(stationRoute.GET, owner, { params: { ...N(), stationId: st.id } })).json()) as {
      station: Record<string, unknown>;
    };
    const put = await call(stationRoute.PUT, owner, {
      method: 'PUT',
      params: { ...N(), stationId: st.id },
      body: { ...got.station, notes: 'Coil moved 3 m north' },
    });
    expect(put.status).toBe(200);
    const role = await call(memberRoute.PATCH, owner, {
      method: 'PATCH',
      params: { ...N(), userId: world().callers.viewer.userId! },
      body: { role: 'analyst' },
    });
    expect(role.status).toBe(200);
    expect((await call(cancelRoute.POST, owner, { method: 'POST', params: { ...N(), runId: newRun } })).status).toBe(200);
    expect((await call(runRoute.DELETE, owner, { method: 'DELETE', params: { ...N(), runId: newRun } })).status).toBe(200);

    const entries = await trail();
    const who = (c: { email: string | null }) => expect.stringContaining(`<${c.email}>`);
    // newest first
    const times = entries.map((e) => Date.parse(e.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    const find = (action: string, subject: string, summary: RegExp) =>
      entries.find((e) => e.action === action && e.subject === subject && summary.test(e.summary));
    expect(find('shared', 'link', /read-only link until/)).toMatchObject({ actor: who(analyst), subjectId: link.id });
    expect(find('changed', 'link', /withdrew/)).toMatchObject({ actor: who(analyst), subjectId: link.id });
    expect(find('created', 'comment', /comment on run/)).toMatchObject({ actor: who(world().callers.viewer) });
    expect(find('exported', 'run', /case file of run/)).toMatchObject({ actor: who(analyst), subjectId: world().runId });
    expect(find('imported', 'run', /case file as run/)).toMatchObject({ actor: who(analyst), subjectId: newRun });
    expect(find('created', 'model', /cavity model/)).toMatchObject({ actor: who(analyst) });
    expect(find('changed', 'station', /station LK1/)).toMatchObject({ actor: who(owner), subjectId: st.id });
    expect(find('changed', 'member', /is now analyst/)).toMatchObject({
      actor: who(owner),
      subjectId: world().callers.viewer.userId,
    });
    expect(find('changed', 'run', /asked run .* to stop/)).toMatchObject({ actor: who(owner), subjectId: newRun });
    expect(find('deleted', 'run', /Imported/)).toMatchObject({ actor: who(owner), subjectId: newRun });
    // A refused import records nothing.
    const before = entries.length;
    const bad = await call(importRoute.POST, analyst, { method: 'POST', params: N(), body: { cavity: 'none' } });
    expect(bad.status).toBe(400);
    expect((await trail()).length).toBe(before);
    // Put the role back for the other tests.
    await upsertMembership(world().networkId, world().callers.viewer.userId!, 'viewer');
  });

  it('CSV: one row per entry, UTC times, formula-like text made inert', async () => {
    const sly = await makeUser('=SUM(A1)', 'audit');
    await upsertMembership(world().networkId, sly.userId, 'owner');
    const made = await call(linksRoute.POST, sly, { method: 'POST', params: R(), body: { expiresInDays: 1 } });
    expect(made.status).toBe(201);
    const res = await call(auditRoute.GET, world().callers.owner, { params: N(), path: '/x?format=csv' });
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    const lines = (await res.text()).trimEnd().split('\n');
    expect(lines[0]).toBe('at_utc,actor,action,subject,subject_id,summary');
    expect(lines.length - 1).toBe((await trail()).length);
    expect(lines[1]).toMatch(
      /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z,'=SUM\(A1\) audit <=sum\(a1\)\.audit@example\.org>,shared,link,/i,
    );
    for (const l of lines.slice(1)) expect(l).not.toMatch(/,=/);
  });
});
