/**
 * Demo accounts and the demo network (an invented scenario): a site
 * administrator, and an owner, an analyst and a viewer of the network
 * "Corrowind Basin ELF Array". Idempotent: accounts are matched by e-mail,
 * the network by name; passwords and roles are reset to the demo values.
 */
import { findUserByEmail, insertUser, setUserAdmin, updateUserPassword } from '@/db/repo/users';
import { createNetwork, findNetworkByName, upsertMembership, type Role } from '@/db/repo/networks';
import { hashPassword, verifyPassword } from '@/src/auth/password';
import { newUserId } from '@/src/auth/accounts';
import type { DemoSignIn } from './types';

export const DEMO_NETWORK_NAME = 'Corrowind Basin ELF Array';

interface DemoAccount extends DemoSignIn {
  name: string;
  admin: boolean;
  networkRole: Role | null;
}

const ACCOUNTS: readonly DemoAccount[] = [
  {
    role: 'administrator',
    email: 'admin@cavitas.example',
    password: 'admin-cavity-2026',
    name: 'Site Administrator',
    admin: true,
    networkRole: null,
  },
  {
    role: 'owner',
    email: 'owner@cavitas.example',
    password: 'owner-cavity-2026',
    name: 'Mara Quillon',
    admin: false,
    networkRole: 'owner',
  },
  {
    role: 'analyst',
    email: 'analyst@cavitas.example',
    password: 'analyst-cavity-2026',
    name: 'Teodor Rask',
    admin: false,
    networkRole: 'analyst',
  },
  {
    role: 'viewer',
    email: 'viewer@cavitas.example',
    password: 'viewer-cavity-2026',
    name: 'Juni Calloway',
    admin: false,
    networkRole: 'viewer',
  },
];

export const DEMO_SIGN_INS: readonly DemoSignIn[] = ACCOUNTS.map(({ role, email, password }) => ({ role, email, password }));

async function ensureAccount(a: DemoAccount): Promise<string> {
  const existing = await findUserByEmail(a.email);
  if (!existing) {
    const u = await insertUser({
      id: newUserId(),
      email: a.email,
      name: a.name,
      passwordHash: await hashPassword(a.password),
      isAdmin: a.admin,
    });
    return u.id;
  }
  if (!(await verifyPassword(existing.passwordHash, a.password)))
    await updateUserPassword(existing.id, await hashPassword(a.password));
  if (existing.isAdmin !== a.admin) await setUserAdmin(existing.id, a.admin);
  return existing.id;
}

/** The demo network's id (after `seed()`), for the other area seeders. */
export async function demoNetworkId(): Promise<string> {
  const net = await findNetworkByName(DEMO_NETWORK_NAME);
  if (!net) throw new Error(`The demo network "${DEMO_NETWORK_NAME}" is missing: run the accounts seeder first`);
  return net.id;
}

export async function seed(): Promise<void> {
  const ids = new Map<string, string>();
  for (const a of ACCOUNTS) ids.set(a.email, await ensureAccount(a));
  const ownerId = ids.get('owner@cavitas.example')!;
  const net = (await findNetworkByName(DEMO_NETWORK_NAME)) ?? (await createNetwork(DEMO_NETWORK_NAME, ownerId));
  for (const a of ACCOUNTS) if (a.networkRole) await upsertMembership(net.id, ids.get(a.email)!, a.networkRole);
}
