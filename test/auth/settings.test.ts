/**
 * Instance settings: defaults, validation with a clear message, and the
 * effect of closing open sign-up (new accounts only through invitations).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { call, errorOf } from '@/test/helpers/authz';
import { DEFAULT_SETTINGS, getInstanceSettings, instanceSettingsSchema, saveInstanceSettings } from '@/src/auth/settings';
import * as signUp from '@/app/api/auth/sign-up/route';

beforeAll(async () => {
  await resetDatabase();
});
afterAll(async () => {
  await closeDatabase();
});

describe('instance settings', () => {
  it('start from the defaults: open sign-up, no notice', async () => {
    expect(await getInstanceSettings()).toEqual(DEFAULT_SETTINGS);
  });

  it('refuse a sign-in notice over 500 characters, naming the limit', () => {
    const r = instanceSettingsSchema.safeParse({ openSignUp: true, signInNotice: 'n'.repeat(501) });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].message).toMatch(/500 characters/);
  });

  it('with open sign-up off, self sign-up is refused with 403 and a way forward', async () => {
    await saveInstanceSettings({ openSignUp: false, signInNotice: 'Maintenance on Sunday 02:00 UTC.' });
    expect(await getInstanceSettings()).toEqual({ openSignUp: false, signInNotice: 'Maintenance on Sunday 02:00 UTC.' });
    const res = await call(signUp.POST, null, {
      method: 'POST',
      body: { email: 'closed.door@example.org', name: 'Closed', password: 'long-enough-pass' },
    });
    expect(res.status).toBe(403);
    expect((await errorOf(res)).message).toMatch(/invitation/);
    await saveInstanceSettings(DEFAULT_SETTINGS);
    const again = await call(signUp.POST, null, {
      method: 'POST',
      body: { email: 'closed.door@example.org', name: 'Open', password: 'long-enough-pass' },
    });
    expect(again.status).toBe(202);
  });
});
