/**
 * Who is asking. Route handlers read the session from the Request's cookie
 * header (so they can be called directly in tests); server components and
 * actions read it through `next/headers`. A renewed ("fresh") session gets a
 * new cookie; an unknown or tampered one is cleared.
 */
import { cache } from 'react';
import type { User as LuciaUser } from 'lucia';
import { getLucia } from './lucia';
import { currentRequestContext, queueSetCookie } from '@/src/server/request-context';

export type User = Pick<LuciaUser, 'id' | 'email' | 'name' | 'isAdmin'>;

function toUser(u: LuciaUser): User {
  return { id: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin };
}

async function validate(sessionId: string | null): Promise<{ user: User | null; setCookie: string | null }> {
  if (!sessionId) return { user: null, setCookie: null };
  const lucia = getLucia();
  const { user, session } = await lucia.validateSession(sessionId);
  if (!session) return { user: null, setCookie: lucia.createBlankSessionCookie().serialize() };
  const setCookie = session.fresh ? lucia.createSessionCookie(session.id).serialize() : null;
  return { user: toUser(user), setCookie };
}

/** For route handlers: the signed-in user from the request's cookie header, or null. */
export async function getSessionUserFromRequest(req: Request): Promise<User | null> {
  const sessionId = getLucia().readSessionCookie(req.headers.get('cookie') ?? '');
  const { user, setCookie } = await validate(sessionId);
  if (setCookie) queueSetCookie(setCookie);
  return user;
}

const fromNextCookies = cache(async (): Promise<User | null> => {
  const { cookies } = await import('next/headers');
  const jar = await cookies();
  const lucia = getLucia();
  const sessionId = jar.get(lucia.sessionCookieName)?.value ?? null;
  const { user, setCookie } = await validate(sessionId);
  if (setCookie) {
    try {
      const c = sessionId && user ? lucia.createSessionCookie(sessionId) : lucia.createBlankSessionCookie();
      jar.set(c.name, c.value, c.attributes);
    } catch {
      // Server components cannot set cookies; the account menu's session check renews it.
    }
  }
  return user;
});

/**
 * The signed-in user, or null. Inside a `route()` handler it reads the
 * request's cookie header; elsewhere (server components, actions) `next/headers`.
 */
export async function getSessionUser(): Promise<User | null> {
  const ctx = currentRequestContext();
  if (ctx) return getSessionUserFromRequest(ctx.req);
  return fromNextCookies();
}

/** Start a session and return its Set-Cookie header value. */
export async function startSession(userId: string): Promise<string> {
  const lucia = getLucia();
  const session = await lucia.createSession(userId, {});
  return lucia.createSessionCookie(session.id).serialize();
}

/** End the session named by the cookie header (if any) and return a clearing Set-Cookie value. */
export async function endSession(cookieHeader: string): Promise<string> {
  const lucia = getLucia();
  const sessionId = lucia.readSessionCookie(cookieHeader);
  if (sessionId) await lucia.invalidateSession(sessionId);
  return lucia.createBlankSessionCookie().serialize();
}
