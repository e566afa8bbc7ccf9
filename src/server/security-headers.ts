/**
 * Security headers for every response (set by proxy.ts): a Content-Security-Policy with a fresh
 * nonce per request for pages (the way the Next.js documentation's "Content Security Policy"
 * guide describes: the proxy puts the policy on the request, Next.js reads the nonce from it and
 * stamps its own inline scripts; the root layout stamps the theme script), plus nosniff, a
 * referrer policy, frame protection, and HSTS when the public address is https.
 *
 * Scripts run only with the nonce ('strict-dynamic' lets those load their chunks). Styles allow
 * 'unsafe-inline': React writes style attributes and the figure library adds <style> elements,
 * and a nonce in style-src would switch that keyword off (CSP Level 3); styles cannot run code.
 */
import { publicHttps } from '@/src/settings';

export const NONCE_HEADER = 'x-nonce';

/** A fresh nonce (128 random bits, base64). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/** The page policy. `dev` adds what `next dev` needs (eval for fast refresh, its websocket). */
export function pagePolicy(nonce: string, opts: { dev: boolean; https: boolean }): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    `connect-src 'self'${opts.dev ? ' ws: wss:' : ''}`,
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ];
  if (opts.https) directives.push('upgrade-insecure-requests');
  return directives.join('; ');
}

/** For API answers (JSON, files): nothing may load from them, nobody may frame them. */
export const API_POLICY = "default-src 'none'; frame-ancestors 'none'";

/** Headers every response carries, whatever its kind. */
export function commonSecurityHeaders(https = publicHttps()): Record<string, string> {
  const h: Record<string, string> = {
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'strict-origin-when-cross-origin',
    'x-frame-options': 'DENY',
  };
  // RFC 6797: only over https; two years is the common preload-list value (common practice).
  if (https) h['strict-transport-security'] = 'max-age=63072000; includeSubDomains';
  return h;
}
