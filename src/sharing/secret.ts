/**
 * The server secret that signs run links: 32 random bytes made once per
 * installation and kept in the instance settings, so that every process (web
 * server, worker) and every restart signs and checks with the same key.
 */
import { randomBytes } from 'node:crypto';
import { readOrCreateSetting } from '@/db/repo/users';

const KEY = 'runLinkSecret';
let cached: string | null = null;

export async function linkSecret(): Promise<string> {
  if (cached) return cached;
  const stored = await readOrCreateSetting(KEY, randomBytes(32).toString('base64url'));
  if (typeof stored !== 'string' || stored.length < 32) throw new Error('the stored run-link secret is not usable');
  cached = stored;
  return stored;
}

/** Tests that truncate the database forget the cached secret with this. */
export function forgetLinkSecret(): void {
  cached = null;
}
