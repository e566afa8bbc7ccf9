/**
 * Callers for authorization tests. `setupCallers()` creates two networks and
 * five callers, each with a real session cookie:
 *   anonymous   – no cookie
 *   viewer, analyst, owner – members of `networkId` with that role
 *   otherOwner  – owner of `otherNetworkId` only (must not see `networkId`)
 * `call(handler, caller, { method, path, body, params })` invokes a route
 * handler module's export directly with the caller's cookie.
 */
import { insertUser } from '@/db/repo/users';
import { createNetwork, upsertMembership } from '@/db/repo/networks';
import { hashPassword } from '@/src/auth/password';
import { startSession } from '@/src/auth/session';
import { newUserId } from '@/src/auth/accounts';

export type CallerName = 'anonymous' | 'viewer' | 'analyst' | 'owner' | 'otherOwner';
export const CALLERS: readonly CallerName[] = ['anonymous', 'viewer', 'analyst', 'owner', 'otherOwner'];

export interface Caller {
  name: CallerName;
  userId: string | null;
  email: string | null;
  /** Value for the Cookie request header, or null for anonymous. */
  cookie: string | null;
}

export interface AuthzWorld {
  networkId: string;
  otherNetworkId: string;
  callers: Record<CallerName, Caller>;
  password: string;
}

export const TEST_PASSWORD = 'corridor-quartz-1783';

/** "name=value" from a Set-Cookie header value. */
export function cookiePair(setCookie: string): string {
  return setCookie.split(';')[0];
}

let passwordHash: string | null = null;

/** Make an account with a session; `tag` keeps e-mails unique per test file. */
export async function makeUser(label: string, tag: string): Promise<Caller & { userId: string; email: string; cookie: string }> {
  passwordHash ??= await hashPassword(TEST_PASSWORD);
  const email = `${label.toLowerCase()}.${tag}@example.org`;
  const u = await insertUser({ id: newUserId(), email, name: `${label} ${tag}`, passwordHash });
  return { name: 'owner', userId: u.id, email: u.email, cookie: cookiePair(await startSession(u.id)) };
}

export async function setupCallers(tag = Math.random().toString(36).slice(2, 8)): Promise<AuthzWorld> {
  const owner = await makeUser('Owner', tag);
  const analyst = await makeUser('Analyst', tag);
  const viewer = await makeUser('Viewer', tag);
  const otherOwner = await makeUser('Otherowner', tag);
  const net = await createNetwork(`Test network ${tag}`, owner.userId);
  await upsertMembership(net.id, analyst.userId, 'analyst');
  await upsertMembership(net.id, viewer.userId, 'viewer');
  const other = await createNetwork(`Other network ${tag}`, otherOwner.userId);
  return {
    networkId: net.id,
    otherNetworkId: other.id,
    password: TEST_PASSWORD,
    callers: {
      anonymous: { name: 'anonymous', userId: null, email: null, cookie: null },
      viewer: { ...viewer, name: 'viewer' },
      analyst: { ...analyst, name: 'analyst' },
      owner: { ...owner, name: 'owner' },
      otherOwner: { ...otherOwner, name: 'otherOwner' },
    },
  };
}

type RouteHandler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface CallOptions {
  method?: string;
  path?: string;
  body?: unknown;
  /** Raw body text (for malformed-JSON checks); wins over `body`. */
  rawBody?: string;
  params?: Record<string, string>;
  headers?: Record<string, string>;
}

export function buildRequest(caller: Caller | null, opts: CallOptions = {}): Request {
  const headers = new Headers(opts.headers);
  if (caller?.cookie) headers.set('cookie', caller.cookie);
  let body: string | undefined;
  if (opts.rawBody !== undefined) body = opts.rawBody;
  else if (opts.body !== undefined) body = JSON.stringify(opts.body);
  if (body !== undefined) headers.set('content-type', 'application/json');
  return new Request(`http://localhost${opts.path ?? '/'}`, { method: opts.method ?? 'GET', headers, body });
}

export async function call(handler: unknown, caller: Caller | null, opts: CallOptions = {}): Promise<Response> {
  const fn = handler as RouteHandler;
  return fn(buildRequest(caller, opts), { params: Promise.resolve(opts.params ?? {}) });
}

/** Response body as the error shape, for assertions. */
export async function errorOf(res: Response): Promise<{ code: string; message: string; field?: string }> {
  const body = (await res.json()) as { error: { code: string; message: string; field?: string } };
  return body.error;
}
