/**
 * Signed link tokens: `<payload>.<signature>`, the payload the base64url of
 * "<link id>:<expiry in Unix seconds>", the signature HMAC-SHA256 of the
 * payload under the server's secret (RFC 2104; common practice for bearer
 * links). Pure: the secret is passed in. A token whose signature does not
 * match is refused before anything is looked up.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';
import { isId } from '@/src/server/ids';

const PURPOSE = 'cavitas-run-link-v1:';

export interface LinkClaims {
  linkId: string;
  expiresAt: Date;
}

function sign(payload: string, secret: string): Buffer {
  return createHmac('sha256', secret)
    .update(PURPOSE + payload)
    .digest();
}

export function signLinkToken(claims: LinkClaims, secret: string): string {
  const seconds = Math.floor(claims.expiresAt.getTime() / 1000);
  const payload = Buffer.from(`${claims.linkId}:${seconds}`, 'utf8').toString('base64url');
  return `${payload}.${sign(payload, secret).toString('base64url')}`;
}

/** The claims of a token signed with `secret`, or null when it is malformed or its signature does not match. */
export function verifyLinkToken(token: string, secret: string): LinkClaims | null {
  const parts = token.split('.');
  if (parts.length !== 2 || !/^[A-Za-z0-9_-]+$/.test(parts[0]) || !/^[A-Za-z0-9_-]+$/.test(parts[1])) return null;
  const [payload, signature] = parts;
  const given = Buffer.from(signature, 'base64url');
  const expected = sign(payload, secret);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  const m = /^([0-9a-f-]{36}):(\d{1,12})$/.exec(Buffer.from(payload, 'base64url').toString('utf8'));
  if (!m || !isId(m[1])) return null;
  return { linkId: m[1], expiresAt: new Date(Number(m[2]) * 1000) };
}
