/**
 * Next.js proxy (runs before every page and API route): security headers on every answer, and a
 * per-request Content-Security-Policy nonce for pages (src/server/security-headers.ts).
 */
import { NextResponse, type NextRequest } from 'next/server';
import { API_POLICY, commonSecurityHeaders, NONCE_HEADER, newNonce, pagePolicy } from '@/src/server/security-headers';
import { publicHttps, settings } from '@/src/settings';

export function proxy(request: NextRequest) {
  const https = publicHttps();
  const common = commonSecurityHeaders(https);
  if (request.nextUrl.pathname.startsWith('/api/')) {
    const res = NextResponse.next();
    for (const [k, v] of Object.entries(common)) res.headers.set(k, v);
    res.headers.set('content-security-policy', API_POLICY);
    return res;
  }
  const nonce = newNonce();
  const policy = pagePolicy(nonce, { dev: settings().NODE_ENV === 'development', https });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set(NONCE_HEADER, nonce);
  requestHeaders.set('content-security-policy', policy);
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  for (const [k, v] of Object.entries(common)) res.headers.set(k, v);
  res.headers.set('content-security-policy', policy);
  return res;
}

export const config = {
  // Not for the build's static files (hashed, served as they are) or the icon.
  // Not for API routes either: a proxy buffers request bodies, which would undo the streamed upload limits;
  // API answers get their headers from next.config.mjs.
  matcher: ['/((?!api/|_next/static|_next/image|icon.svg|fonts/).*)'],
};
