/**
 * lucia v3 set-up: 30-day database sessions, renewed ("fresh") once less than
 * half the lifetime is left. Cookie: httpOnly, SameSite=Lax, Secure in
 * production unless COOKIE_SECURE=false (plain-http loopback serving).
 */
import { Lucia, TimeSpan } from 'lucia';
import { sessionAdapter } from '@/db/repo/users';
import { cookieSecure } from '@/src/settings';

export const SESSION_COOKIE = 'cavitas_session';

function createLucia() {
  return new Lucia(sessionAdapter(), {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: {
      name: SESSION_COOKIE,
      expires: true,
      attributes: { secure: cookieSecure(), sameSite: 'lax', path: '/' },
    },
    getUserAttributes: (a) => ({ email: a.email, name: a.name, isAdmin: a.isAdmin }),
  });
}

let instance: ReturnType<typeof createLucia> | null = null;

export function getLucia(): ReturnType<typeof createLucia> {
  instance ??= createLucia();
  return instance;
}

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    DatabaseUserAttributes: { email: string; name: string; isAdmin: boolean };
  }
}
