import { can, requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, requestOrigin, route } from '@/src/server/route';
import { requireId } from '@/src/server/ids';
import { createRunLink, newLinkSchema, runLinks } from '@/src/sharing/links';

type P = { networkId: string; runId: string };

/** The run's read-only links with who made each and when; the URLs only for members who may share. */
export const GET = route<P>(async (req, { params }) => {
  const { membership } = await requireNetworkAction(params.networkId, 'network.read');
  const runId = requireId(params.runId, 'run');
  const links = await runLinks(params.networkId, runId, requestOrigin(req), can(membership.role, 'runs.share'));
  return json({ links }, 200, { 'cache-control': 'no-store' });
});

/** A new read-only link to this run: `{ expiresInDays }` → 201 `{ id, url, expiresAt }`. */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.share');
  const runId = requireId(params.runId, 'run');
  const body = await parseJson(req, newLinkSchema);
  return json(await createRunLink(params.networkId, runId, user.id, body.expiresInDays, requestOrigin(req)), 201);
});
