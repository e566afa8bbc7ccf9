/**
 * THE permission module. Every page, route handler and server action asks
 * here: who is asking (`requireUser`), may their role in this network do this
 * (`requireNetworkAction`), are they a site administrator (`requireAdmin`).
 *
 * Owners manage members, stations, tokens and deletion, and read the audit trail; analysts upload data,
 * edit models and grids and launch/cancel runs; viewers read and export.
 */
import { getMembership, type MembershipInfo } from '@/db/repo/networks';
import { forbidden, notFound, unauthorized } from '@/src/server/errors';
import { getSessionUser, type User } from './session';

export type Role = 'owner' | 'analyst' | 'viewer';
export const ROLES: readonly Role[] = ['owner', 'analyst', 'viewer'];

export type Action =
  | 'network.read'
  | 'network.manage'
  | 'members.manage'
  | 'stations.manage'
  | 'tokens.manage'
  | 'data.upload'
  | 'data.flag'
  | 'data.delete'
  | 'models.edit'
  | 'grids.edit'
  | 'runs.launch'
  | 'runs.cancel'
  | 'runs.delete'
  | 'runs.share'
  | 'comments.write'
  | 'export'
  | 'audit.read'
  | 'admin.mail'
  | 'admin.settings';

const O: Role = 'owner';
const A: Role = 'analyst';
const V: Role = 'viewer';

/** Which network roles hold each action. Site-administration actions belong to no role. */
export const GRANTS: Readonly<Record<Action, readonly Role[]>> = {
  'network.read': [O, A, V],
  export: [O, A, V],
  'comments.write': [O, A, V],
  'data.upload': [O, A],
  'data.flag': [O, A],
  'models.edit': [O, A],
  'grids.edit': [O, A],
  'runs.launch': [O, A],
  'runs.cancel': [O, A],
  'runs.share': [O, A],
  'network.manage': [O],
  'members.manage': [O],
  'stations.manage': [O],
  'tokens.manage': [O],
  'data.delete': [O],
  'runs.delete': [O],
  'audit.read': [O],
  'admin.mail': [],
  'admin.settings': [],
};

export function can(role: Role | null | undefined, action: Action): boolean {
  return !!role && GRANTS[action].includes(role);
}

/** Human wording of the roles, for the UI. */
export const ROLE_LABEL: Record<Role, string> = { owner: 'Owner', analyst: 'Analyst', viewer: 'Viewer' };
export const ROLE_SUMMARY: Record<Role, string> = {
  owner: 'Manages members, stations, push tokens and deletions, plus everything an analyst does.',
  analyst: 'Uploads data, flags intervals, edits cavity models and source grids, launches and cancels runs, shares runs by link.',
  viewer: 'Reads everything in the network, exports results and comments on runs.',
};

export async function requireUser(): Promise<User> {
  const user = await getSessionUser();
  if (!user) throw unauthorized();
  return user;
}

export interface NetworkAccess {
  user: User;
  membership: MembershipInfo;
}

/**
 * 401 when nobody is signed in; 404 when the user is not a member (so other
 * networks' ids are not revealed); 403 when the role lacks the action.
 */
export async function requireNetworkAction(networkId: string, action: Action): Promise<NetworkAccess> {
  const user = await requireUser();
  const membership = await getMembership(networkId, user.id);
  if (!membership) throw notFound('This network does not exist or you are not a member of it.');
  if (!can(membership.role, action)) {
    throw forbidden(`Your role in this network (${membership.role}) does not allow this. Ask an owner if you need it.`);
  }
  return { user, membership };
}

export async function requireAdmin(): Promise<User> {
  const user = await requireUser();
  if (!user.isAdmin) throw forbidden('Only site administrators can open this.');
  return user;
}
