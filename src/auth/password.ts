/**
 * Password hashing with argon2id (@node-rs/argon2 default algorithm) at the
 * OWASP Password Storage Cheat Sheet minimum: m = 19 MiB, t = 2, p = 1.
 */
import { hash, verify } from '@node-rs/argon2';
import { z } from 'zod';

const PARAMS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export const MIN_PASSWORD_LENGTH = 10;
export const MAX_PASSWORD_LENGTH = 256;

export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(MIN_PASSWORD_LENGTH, { error: `Use at least ${MIN_PASSWORD_LENGTH} characters for the password.` })
  .max(MAX_PASSWORD_LENGTH, { error: `Use at most ${MAX_PASSWORD_LENGTH} characters for the password.` });

export function hashPassword(password: string): Promise<string> {
  return hash(password, PARAMS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
