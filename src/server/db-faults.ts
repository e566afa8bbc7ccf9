/**
 * The database out of reach — restarting, shut down, refusing connections, or a connection
 * lost mid-statement — is a temporary fault of the service, not of the request: the API answers
 * 503 with Retry-After (RFC 9110 §15.6.4, §10.2.3) and the client sends the same request again.
 * Writes run in transactions, so a lost connection leaves nothing half-stored.
 */
import { AppError } from './errors';

/** Seconds a client is asked to wait before sending the request again. */
export const DATABASE_RETRY_AFTER_S = 10;

/**
 * SQLSTATE classes and codes (PostgreSQL manual, appendix A): 08 connection exception, 57P01
 * admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now, 53300 too_many_connections.
 */
const SQLSTATES = /^(08[0-9A-Z]{3}|57P0[123]|53300)$/;
/** Socket errors (Node) and postgres.js's own codes for a connection that went away or never came. */
const CONNECTION_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'CONNECTION_CLOSED',
  'CONNECTION_ENDED',
  'CONNECTION_DESTROYED',
  'CONNECT_TIMEOUT',
]);

/** Whether an error (or one it wraps, as drizzle and pg-boss do) says the database could not be reached. */
export function isDatabaseFault(e: unknown): boolean {
  let cur: unknown = e;
  for (let depth = 0; cur && typeof cur === 'object' && depth < 5; depth++) {
    if (cur instanceof AppError) return false;
    const code = (cur as { code?: unknown }).code;
    if (typeof code === 'string' && (SQLSTATES.test(code) || CONNECTION_CODES.has(code))) return true;
    const errors = (cur as { errors?: unknown }).errors; // AggregateError: every address refused
    if (Array.isArray(errors) && errors.length && errors.every((x) => isDatabaseFault(x))) return true;
    cur = (cur as { cause?: unknown }).cause;
  }
  return false;
}

/** The innermost cause's message, for the log (not the failed statement and its parameters). */
export function databaseFaultReason(e: unknown): string {
  let cur: unknown = e;
  while (cur && typeof cur === 'object' && (cur as { cause?: unknown }).cause) cur = (cur as { cause: unknown }).cause;
  return cur instanceof Error ? cur.message : String((cur as { code?: unknown })?.code ?? cur);
}

export function databaseUnavailableResponse(): Response {
  return Response.json(
    {
      error: {
        code: 'unavailable',
        message: `The database is not reachable just now (it may be restarting); nothing was stored. Send the request again in ${DATABASE_RETRY_AFTER_S} seconds.`,
      },
    },
    { status: 503, headers: { 'retry-after': String(DATABASE_RETRY_AFTER_S), 'cache-control': 'no-store' } },
  );
}
