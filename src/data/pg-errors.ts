/** Recognises PostgreSQL errors by SQLSTATE, whether drizzle wrapped them or not. */
export function pgCode(e: unknown): string | undefined {
  let cur: unknown = e;
  for (let depth = 0; cur && depth < 4; depth++) {
    const code = (cur as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
    cur = (cur as { cause?: unknown }).cause;
  }
  return undefined;
}

/** 23505 unique_violation (PostgreSQL error codes appendix). */
export const isUniqueViolation = (e: unknown) => pgCode(e) === '23505';
