/**
 * The one error type that crosses from data access and permission checks to
 * the HTTP edge. `route()` turns it into `{ error: { code, message, field } }`.
 */
export class AppError extends Error {
  readonly status: number;
  readonly code: string;
  readonly field?: string;
  /** Seconds the client should wait before trying again; sent as the Retry-After header. */
  readonly retryAfterS?: number;

  constructor(status: number, code: string, message: string, field?: string, retryAfterS?: number) {
    super(message);
    this.name = 'AppError';
    this.status = status;
    this.code = code;
    this.field = field;
    this.retryAfterS = retryAfterS;
  }
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}

export const badRequest = (message: string, field?: string) => new AppError(400, 'bad_request', message, field);

export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message);

export const forbidden = (message = 'Your role in this network does not allow this.') => new AppError(403, 'forbidden', message);

export const notFound = (message = 'Nothing was found at this address.') => new AppError(404, 'not_found', message);

export const conflict = (message: string, field?: string) => new AppError(409, 'conflict', message, field);

export const gone = (message: string) => new AppError(410, 'gone', message);

export const tooManyRequests = (message: string, retryAfterS?: number) =>
  new AppError(429, 'throttled', message, undefined, retryAfterS === undefined ? undefined : Math.max(1, Math.ceil(retryAfterS)));

/** The JSON body every failing API response carries. */
export interface ErrorBody {
  error: { code: string; message: string; field?: string };
}
