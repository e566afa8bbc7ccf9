/**
 * Random single-use tokens for e-mailed links (password reset, invitation).
 * The link carries the token; the database keeps only its SHA-256.
 */
import { createHash, randomBytes } from 'node:crypto';

export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export const DAY_MS = 24 * 60 * 60 * 1000;
export const INVITATION_LIFETIME_MS = 7 * DAY_MS;
export const RESET_LIFETIME_MS = 60 * 60 * 1000;
