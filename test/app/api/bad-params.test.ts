/**
 * Query parameters are checked before use: a malformed day on the interval list, export and
 * spectra routes is a 400 that names the field (RFC 9110 §15.5.1), never a 500. A real calendar
 * day (ISO 8601 / RFC 3339 full-date, 2026-13-45 and 2026-02-30 are none) still answers.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { call, errorOf, setupCallers, type AuthzWorld } from '@/test/helpers/authz';
import * as intervalsRoute from '@/app/api/networks/[networkId]/intervals/route';
import * as exportRoute from '@/app/api/networks/[networkId]/intervals/export/route';
import * as spectraRoute from '@/app/api/networks/[networkId]/intervals/spectra/route';

let w: AuthzWorld;
beforeAll(async () => {
  await resetDatabase();
  w = await setupCallers('params');
});
afterAll(closeDatabase);

const routes = { intervals: intervalsRoute.GET, export: exportRoute.GET, spectra: spectraRoute.GET };

describe('a malformed day', () => {
  for (const [name, handler] of Object.entries(routes)) {
    it(`is a 400 naming "day" on the ${name} route`, async () => {
      for (const day of ['2026-13-45', '2026-02-30', '26-03-01', 'today']) {
        const res = await call(handler, w.callers.owner, { path: `/x?day=${day}`, params: { networkId: w.networkId } });
        expect(res.status, day).toBe(400);
        expect((await errorOf(res)).field).toBe('day');
      }
      const ok = await call(handler, w.callers.owner, { path: '/x?day=2024-02-29', params: { networkId: w.networkId } });
      expect(ok.status).toBe(200);
    });
  }
});
