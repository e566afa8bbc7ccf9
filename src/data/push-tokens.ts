/**
 * Station push tokens: issued by owners (the secret is shown once, only its
 * SHA-256 is kept), checked on every push, counted per fixed one-minute window.
 */
import { createHash, randomBytes } from 'node:crypto';
import * as repo from '@/db/repo/push-tokens';
import { AppError, notFound, tooManyRequests } from '@/src/server/errors';
import { settings } from '@/src/settings';

/** Requests one token may make per window, and the window length (env PUSH_RATE_PER_MINUTE). */
export function pushRateLimit(): { max: number; windowSeconds: number } {
  return { max: settings().PUSH_RATE_PER_MINUTE, windowSeconds: 60 };
}

const PREFIX = 'cvs_';

export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

export async function issuePushToken(
  networkId: string,
  stationId: string,
  createdBy: string,
  opts: { label: string; expiresInDays: number | null },
): Promise<{ token: repo.PushTokenInfo; secret: string }> {
  const secret = PREFIX + randomBytes(32).toString('base64url');
  const expiresAt = opts.expiresInDays ? new Date(Date.now() + opts.expiresInDays * 86_400_000) : null;
  const token = await repo.createPushToken({
    networkId,
    stationId,
    label: opts.label,
    secretHash: hashSecret(secret),
    hint: `${secret.slice(0, PREFIX.length + 4)}…`,
    createdBy,
    expiresAt,
  });
  return { token, secret };
}

export async function revokePushToken(networkId: string, stationId: string, tokenId: string) {
  const t = await repo.revokePushToken(networkId, stationId, tokenId);
  if (!t) throw notFound('No such push token for this station.');
  return t;
}

export const listPushTokens = repo.listPushTokens;

const refused = (code: string, message: string) => new AppError(401, code, message, 'authorization');

/**
 * The token behind an `Authorization: Bearer …` header, counted against its
 * rate window. 401 for a missing, unknown, revoked or expired token; 429 with
 * the wait when the window is full.
 */
export async function authenticatePush(authorization: string | null) {
  const m = /^Bearer\s+(\S+)\s*$/i.exec(authorization ?? '');
  if (!m) throw refused('token_missing', 'Send the station token as "Authorization: Bearer <token>".');
  const token = await repo.findPushTokenByHash(hashSecret(m[1]));
  if (!token) throw refused('token_unknown', 'This push token is not known. Ask a network owner for a new one.');
  if (token.revokedAt) throw refused('token_revoked', 'This push token was revoked. Ask a network owner for a new one.');
  if (token.expiresAt && token.expiresAt.getTime() <= Date.now()) {
    throw refused(
      'token_expired',
      `This push token expired on ${token.expiresAt.toISOString()}. Ask a network owner for a new one.`,
    );
  }
  const { max, windowSeconds } = pushRateLimit();
  const { count, resetInS } = await repo.countPushRequest(token.id, windowSeconds);
  if (count > max) {
    const wait = Math.max(1, Math.ceil(resetInS));
    throw Object.assign(tooManyRequests(`This token may push ${max} times per ${windowSeconds} s; try again in ${wait} s.`), {
      retryAfterS: wait,
    });
  }
  return token;
}
