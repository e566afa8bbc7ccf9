/**
 * Writes from another site's page are refused (defence in depth beside SameSite=Lax cookies):
 * a state-changing request (anything but GET, HEAD, OPTIONS) whose Origin header is `null`
 * (sandboxed frames, opaque redirects, file: pages) or names another origin than this app's is
 * a 403. Browsers send Origin on every such request (Fetch standard, "append a request Origin
 * header"); callers that send none — the command line, station pushes with a bearer token —
 * carry no ambient cookie of a visitor and pass. Sec-Fetch-Site: cross-site is refused too.
 */
import { forbidden } from './errors';
import { settings } from '@/src/settings';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Origins this app answers as: APP_URL and the request's own host (as forwarded by a proxy). */
function ownOrigins(req: Request): Set<string> {
  const out = new Set<string>();
  const configured = settings().APP_URL;
  if (configured) out.add(new URL(configured).origin);
  const url = new URL(req.url);
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host');
  const proto = req.headers.get('x-forwarded-proto') ?? url.protocol.replace(':', '');
  out.add(host ? `${proto}://${host}` : url.origin);
  return out;
}

/** Throws 403 for a cross-site or `null`-origin write; returns quietly otherwise. */
export function assertSameOrigin(req: Request): void {
  if (SAFE.has(req.method.toUpperCase())) return;
  const refuse = () => forbidden('This request came from another site and was refused.');
  if (req.headers.get('sec-fetch-site') === 'cross-site') throw refuse();
  const origin = req.headers.get('origin');
  if (origin === null) return;
  if (origin.trim() === '' || origin === 'null') throw refuse();
  let theirs: string;
  try {
    theirs = new URL(origin).origin;
  } catch {
    throw refuse();
  }
  if (!ownOrigins(req).has(theirs)) throw refuse();
}
