/**
 * Read-only links to one run. An owner or analyst makes one (it expires after
 * the days they choose), every member sees the list with who made each link
 * and when, and a link can be revoked. Opening a link checks its signature
 * first (a tampered token is refused without a lookup), then that the link
 * still stands: revoked or expired links are "gone", never an error.
 */
import { record } from '@/src/audit';
import { z } from 'zod';
import { getRun } from '@/db/repo/runs';
import { getRunLink, insertRunLink, listRunLinks, revokeRunLink, type RunLinkEntry, type RunLinkRow } from '@/db/repo/sharing';
import { gone, notFound } from '@/src/server/errors';
import { linkSecret } from './secret';
import { signLinkToken, verifyLinkToken } from './tokens';

export const MAX_LINK_DAYS = 365;

export const newLinkSchema = z.object({
  expiresInDays: z
    .number({ error: 'expiresInDays must be a number of days' })
    .int('expiresInDays must be a whole number of days')
    .min(1, 'a link lasts at least 1 day')
    .max(MAX_LINK_DAYS, `a link lasts at most ${MAX_LINK_DAYS} days`)
    .default(7),
});

export type LinkState = 'active' | 'revoked' | 'expired';

export interface RunLinkView {
  id: string;
  runId: string;
  /** Present for members who may share (owners and analysts). */
  url?: string;
  state: LinkState;
  createdAt: string;
  createdBy: string | null;
  expiresAt: string;
  revokedAt: string | null;
  revokedBy: string | null;
}

export function sharedPath(token: string): string {
  return `/shared/${token}`;
}

function stateOf(l: RunLinkRow, now: Date): LinkState {
  if (l.revokedAt) return 'revoked';
  return l.expiresAt.getTime() <= now.getTime() ? 'expired' : 'active';
}

async function tokenOf(l: RunLinkRow): Promise<string> {
  return signLinkToken({ linkId: l.id, expiresAt: l.expiresAt }, await linkSecret());
}

async function viewOf(l: RunLinkEntry, origin: string, withUrl: boolean, now: Date): Promise<RunLinkView> {
  return {
    id: l.id,
    runId: l.runId,
    ...(withUrl ? { url: origin + sharedPath(await tokenOf(l)) } : {}),
    state: stateOf(l, now),
    createdAt: l.createdAt.toISOString(),
    createdBy: l.createdByName,
    expiresAt: l.expiresAt.toISOString(),
    revokedAt: l.revokedAt?.toISOString() ?? null,
    revokedBy: l.revokedByName,
  };
}

async function requireRun(networkId: string, runId: string): Promise<{ name: string }> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  return run;
}

/** A new link to the run, valid for `expiresInDays` days from now (whole seconds). */
export async function createRunLink(
  networkId: string,
  runId: string,
  userId: string,
  expiresInDays: number,
  origin: string,
): Promise<{ id: string; url: string; expiresAt: string }> {
  const run = await requireRun(networkId, runId);
  const expiresAt = new Date(Math.floor((Date.now() + expiresInDays * 86_400_000) / 1000) * 1000);
  const row = await insertRunLink({ networkId, runId, createdBy: userId, expiresAt });
  const summary = `run "${run.name}" by a read-only link until ${row.expiresAt.toISOString()}`;
  await record({ networkId, actorId: userId, action: 'shared', subject: 'link', subjectId: row.id, summary });
  return { id: row.id, url: origin + sharedPath(await tokenOf(row)), expiresAt: row.expiresAt.toISOString() };
}

export async function runLinks(networkId: string, runId: string, origin: string, withUrls: boolean): Promise<RunLinkView[]> {
  await requireRun(networkId, runId);
  const now = new Date();
  return Promise.all((await listRunLinks(networkId, runId)).map((l) => viewOf(l, origin, withUrls, now)));
}

export async function revokeLink(networkId: string, runId: string, linkId: string, userId: string): Promise<void> {
  const row = await revokeRunLink(networkId, runId, linkId, userId);
  if (!row) throw notFound('That link is not on this run.');
  await record({
    networkId,
    actorId: userId,
    action: 'changed',
    subject: 'link',
    subjectId: linkId,
    summary: 'withdrew a read-only link',
  });
}

export type OpenedLink =
  | { kind: 'open'; networkId: string; runId: string; linkId: string; expiresAt: Date }
  | { kind: 'gone'; why: 'revoked' | 'expired' }
  | { kind: 'invalid' };

/** What a token opens: its run, or why it opens nothing. */
export async function openLink(token: string, now = new Date()): Promise<OpenedLink> {
  const claims = verifyLinkToken(token, await linkSecret());
  if (!claims) return { kind: 'invalid' };
  const row = await getRunLink(claims.linkId);
  if (!row || row.expiresAt.getTime() !== claims.expiresAt.getTime()) return { kind: 'invalid' };
  const state = stateOf(row, now);
  if (state !== 'active') return { kind: 'gone', why: state };
  return { kind: 'open', networkId: row.networkId, runId: row.runId, linkId: row.id, expiresAt: row.expiresAt };
}

/** The run a token opens; a 404 for a bad token and a 410 for a revoked or expired one (API use). */
export async function requireLink(token: string): Promise<{ networkId: string; runId: string }> {
  const o = await openLink(token);
  if (o.kind === 'open') return o;
  if (o.kind === 'gone') throw goneError(o.why);
  throw notFound('This link is not valid.');
}

export function goneError(why: 'revoked' | 'expired') {
  return gone(
    why === 'revoked'
      ? 'This link was withdrawn by the people who shared it.'
      : 'This link has expired. Ask whoever shared it for a new one.',
  );
}
