/**
 * Wrapper for every JSON route handler: runs the handler inside a request
 * context, turns AppError / ZodError into the one error shape with the right
 * status, never leaks a stack trace, and attaches queued Set-Cookie headers.
 *
 *   export const POST = route(async (req, { params }) => {
 *     const { networkId } = await params;
 *     await requireNetworkAction(networkId, 'runs.launch');
 *     const body = await parseJson(req, schema);
 *     return json(await launchRun(networkId, body), 201);
 *   });
 */
import { ZodError, type z } from 'zod';
import { AppError, badRequest, type ErrorBody } from './errors';
import { assertSameOrigin } from './same-origin';
import { currentRequestContext, runWithRequest } from './request-context';
import { readJsonText } from './body-limit';
import { databaseFaultReason, databaseUnavailableResponse, isDatabaseFault } from './db-faults';
import { settings } from '@/src/settings';

type Handler<P> = (req: Request, ctx: { params: P }) => Promise<Response | unknown>;

export function json(data: unknown, status = 200, headers?: HeadersInit): Response {
  return Response.json(data, { status, headers });
}

export function errorResponse(status: number, body: ErrorBody, retryAfterS?: number): Response {
  const headers: Record<string, string> = { 'cache-control': 'no-store' };
  if (retryAfterS !== undefined) headers['retry-after'] = String(retryAfterS);
  return Response.json(body, { status, headers });
}

function fieldOf(path: ReadonlyArray<PropertyKey>): string | undefined {
  return path.length ? path.map(String).join('.') : undefined;
}

/** Map any thrown value to a Response in the one error shape. */
export function toErrorResponse(e: unknown): Response {
  if (e instanceof AppError) {
    const error: ErrorBody['error'] = { code: e.code, message: e.message };
    if (e.field) error.field = e.field;
    return errorResponse(e.status, { error }, e.retryAfterS);
  }
  if (e instanceof ZodError) {
    const issue = e.issues[0];
    const field = issue ? fieldOf(issue.path) : undefined;
    const message = issue ? (field ? `${field}: ${issue.message}` : issue.message) : 'The request is not valid.';
    const error: ErrorBody['error'] = { code: 'invalid_input', message };
    if (field) error.field = field;
    return errorResponse(400, { error });
  }
  if (isDatabaseFault(e)) {
    console.error(`[cavitas] database not reachable: ${databaseFaultReason(e)}`);
    return databaseUnavailableResponse();
  }
  console.error('[cavitas] unhandled error in route handler', e);
  return errorResponse(500, {
    error: { code: 'internal', message: 'Something went wrong on the server. The problem has been logged; please try again.' },
  });
}

export function route<P = Record<string, string>>(handler: Handler<P>) {
  return async (req: Request, ctx?: { params: Promise<P> }): Promise<Response> =>
    runWithRequest(req, async () => {
      let res: Response;
      try {
        assertSameOrigin(req);
        const params = (ctx?.params ? await ctx.params : {}) as P;
        const out = await handler(req, { params });
        res = out instanceof Response ? out : json(out ?? { ok: true });
      } catch (e) {
        res = toErrorResponse(e);
      }
      const pending = currentRequestContext()?.setCookies ?? [];
      for (const c of pending) res.headers.append('set-cookie', c);
      return res;
    });
}

/** Public origin for links in e-mails: APP_URL when set, else the request's own origin. */
export function requestOrigin(req: Request): string {
  const configured = settings().APP_URL;
  if (configured) return configured;
  const url = new URL(req.url);
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host');
  const proto = req.headers.get('x-forwarded-proto') ?? url.protocol.replace(':', '');
  return host ? `${proto}://${host}` : url.origin;
}

/** Parse and validate a JSON body; a body that is not JSON is a 400 naming the problem. */
export async function parseJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  const text = await readJsonText(req); // 413 past the body cap, before any parsing
  let data: unknown;
  try {
    data = text.trim() === '' ? {} : JSON.parse(text);
  } catch {
    throw badRequest('The request body is not valid JSON.');
  }
  return schema.parse(data);
}

/** Parse and validate the query string (all values arrive as strings). */
export function parseQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const params = new URL(req.url).searchParams;
  return schema.parse(Object.fromEntries(params.entries()));
}
