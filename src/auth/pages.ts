/**
 * The permission checks for server components (pages and layouts): the same
 * rules as `permissions.ts`, turned into navigation — not signed in goes to
 * the sign-in page, not a member is a 404 page, a role without the action
 * gets the network overview with a notice.
 */
import { notFound, redirect } from 'next/navigation';
import { AppError } from '@/src/server/errors';
import { requireAdmin, requireNetworkAction, requireUser, type Action, type NetworkAccess } from './permissions';
import type { User } from './session';

function handle(e: unknown, networkId?: string): never {
  if (e instanceof AppError) {
    if (e.status === 401) redirect('/sign-in');
    if (e.status === 404) notFound();
    if (e.status === 403) redirect(networkId ? `/n/${networkId}?denied=1` : '/networks?denied=1');
  }
  throw e;
}

export async function pageUser(): Promise<User> {
  try {
    return await requireUser();
  } catch (e) {
    handle(e);
  }
}

export async function pageNetworkAction(networkId: string, action: Action): Promise<NetworkAccess> {
  try {
    return await requireNetworkAction(networkId, action);
  } catch (e) {
    handle(e, networkId);
  }
}

export async function pageAdmin(): Promise<User> {
  try {
    return await requireAdmin();
  } catch (e) {
    if (e instanceof AppError && e.status === 403) notFound();
    handle(e);
  }
}
