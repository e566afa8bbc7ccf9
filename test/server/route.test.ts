/**
 * The route wrapper's contract: the one error shape with the right status
 * (RFC 9110 §15.5 status semantics: 400 bad input, 401 unauthenticated,
 * 403 forbidden, 404 not found, 409 conflict, 429 throttled), never a stack
 * trace, and writes from another origin refused (OWASP CSRF Prevention Cheat
 * Sheet, "verifying origin with standard headers").
 */
import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { parseJson, parseQuery, route } from '@/src/server/route';
import { badRequest, conflict, forbidden, notFound, tooManyRequests, unauthorized } from '@/src/server/errors';

const req = (init: RequestInit & { url?: string } = {}) => new Request(init.url ?? 'http://localhost/api/x', init);

describe('route()', () => {
  it('maps each AppError helper to its status and code', async () => {
    const cases: Array<[Error, number, string]> = [
      [badRequest('Bad thing.', 'name'), 400, 'bad_request'],
      [unauthorized(), 401, 'unauthorized'],
      [forbidden(), 403, 'forbidden'],
      [notFound(), 404, 'not_found'],
      [conflict('Taken.', 'email'), 409, 'conflict'],
      [tooManyRequests('Slow down.'), 429, 'throttled'],
    ];
    for (const [err, status, code] of cases) {
      const res = await route(async () => {
        throw err;
      })(req());
      expect(res.status).toBe(status);
      const body = await res.json();
      expect(body.error.code).toBe(code);
      expect(body.error.message).toBe(err.message);
    }
  });

  it('turns a zod failure into 400 naming the field path', async () => {
    const schema = z.object({ grid: z.object({ step: z.number({ error: 'Give the step in degrees.' }) }) });
    const res = await route(async (r) => parseJson(r, schema))(req({ method: 'POST', body: '{"grid":{}}' }));
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: { code: 'invalid_input', message: 'grid.step: Give the step in degrees.', field: 'grid.step' },
    });
  });

  it('answers an unexpected error with 500 and no stack trace', async () => {
    const spy = vi.spyOn(console, 'error').mockImplementation(() => {});
    const res = await route(async () => {
      throw new TypeError('secret internals at /work/main/src/x.ts:12');
    })(req());
    spy.mockRestore();
    expect(res.status).toBe(500);
    const text = await res.text();
    expect(text).not.toMatch(/secret internals|\.ts:\d+/);
    expect(JSON.parse(text).error.code).toBe('internal');
  });

  it('refuses a write whose Origin is another site, allows same-origin and reads', async () => {
    const h = route(async () => ({ ok: true }));
    const cross = await h(req({ method: 'POST', headers: { origin: 'https://evil.example', host: 'localhost' } }));
    expect(cross.status).toBe(403);
    const same = await h(req({ method: 'POST', headers: { origin: 'http://localhost', host: 'localhost' } }));
    expect(same.status).toBe(200);
    const read = await h(req({ headers: { origin: 'https://evil.example', host: 'localhost' } }));
    expect(read.status).toBe(200);
  });

  it('passes resolved params and parses the query', async () => {
    const h = route<{ id: string }>(async (r, { params }) => ({
      id: params.id,
      q: parseQuery(r, z.object({ n: z.coerce.number() })),
    }));
    const res = await h(req({ url: 'http://localhost/api/x?n=7' }), { params: Promise.resolve({ id: 'abc' }) });
    expect(await res.json()).toEqual({ id: 'abc', q: { n: 7 } });
  });
});
