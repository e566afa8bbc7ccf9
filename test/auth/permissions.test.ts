/**
 * The role table: owners hold every network action, analysts the working
 * actions, viewers read and export only; no network role holds site
 * administration. Least privilege (common practice; NIST SP 800-53 AC-6).
 */
import { describe, expect, it } from 'vitest';
import { can, GRANTS, type Action } from '@/src/auth/permissions';

const all = Object.keys(GRANTS) as Action[];
const admin: Action[] = ['admin.mail', 'admin.settings'];
const analystActions: Action[] = [
  'network.read',
  'export',
  'comments.write',
  'data.upload',
  'data.flag',
  'models.edit',
  'grids.edit',
  'runs.launch',
  'runs.cancel',
  'runs.share',
];
const ownerOnly: Action[] = [
  'network.manage',
  'members.manage',
  'stations.manage',
  'tokens.manage',
  'data.delete',
  'runs.delete',
];

describe('can(role, action)', () => {
  it('owners can do every network action and no site-administration action', () => {
    for (const a of all) expect(can('owner', a), a).toBe(!admin.includes(a));
  });
  it('analysts can do exactly the working actions', () => {
    for (const a of all) expect(can('analyst', a), a).toBe(analystActions.includes(a));
  });
  it('viewers can only read, export and comment', () => {
    for (const a of all) expect(can('viewer', a), a).toBe(a === 'network.read' || a === 'export' || a === 'comments.write');
  });
  it('owner-only actions are denied to analysts and viewers', () => {
    for (const a of ownerOnly) expect([can('analyst', a), can('viewer', a)], a).toEqual([false, false]);
  });
  it('no role means nothing', () => {
    for (const a of all) expect(can(null, a)).toBe(false);
  });
});
