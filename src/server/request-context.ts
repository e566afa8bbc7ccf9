/**
 * Per-request context for route handlers: the incoming Request and the
 * Set-Cookie headers to add to the response (session renewal, sign-out).
 * Lets permission checks read the session from the Request's cookie header
 * without Next's `next/headers`, so handlers can be called directly in tests.
 */
import { AsyncLocalStorage } from 'node:async_hooks';

export interface RequestContext {
  req: Request;
  setCookies: string[];
}

const storage = new AsyncLocalStorage<RequestContext>();

export function runWithRequest<T>(req: Request, fn: () => Promise<T>): Promise<T> {
  return storage.run({ req, setCookies: [] }, fn);
}

export function currentRequestContext(): RequestContext | undefined {
  return storage.getStore();
}

/** Queue a Set-Cookie header for the response of the current route handler. */
export function queueSetCookie(serialized: string): void {
  storage.getStore()?.setCookies.push(serialized);
}
