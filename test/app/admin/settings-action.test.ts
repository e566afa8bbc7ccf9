/**
 * The instance-settings server action checks the caller through the
 * permission module: only site administrators can save; everyone else gets a
 * clear refusal and nothing is stored.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { buildRequest, makeUser, setupCallers, type AuthzWorld } from '@/test/helpers/authz';
import { runWithRequest } from '@/src/server/request-context';
import { setUserAdmin } from '@/db/repo/users';
import { getInstanceSettings, DEFAULT_SETTINGS } from '@/src/auth/settings';
import { saveSettingsAction } from '@/app/admin/settings/actions';

let w: AuthzWorld;
beforeAll(async () => {
  await resetDatabase();
  w = await setupCallers('settings');
});
afterAll(async () => {
  await closeDatabase();
});

function form(openSignUp: boolean, notice: string): FormData {
  const f = new FormData();
  if (openSignUp) f.set('openSignUp', 'on');
  f.set('signInNotice', notice);
  return f;
}

describe('saveSettingsAction', () => {
  it('refuses anonymous callers and every network role, storing nothing', async () => {
    for (const c of ['anonymous', 'viewer', 'analyst', 'owner', 'otherOwner'] as const) {
      const r = await runWithRequest(buildRequest(w.callers[c]), () => saveSettingsAction(null, form(false, 'hijacked')));
      expect(r.ok, c).toBe(false);
      expect(r.message.length, c).toBeGreaterThan(10);
    }
    expect(await getInstanceSettings()).toEqual(DEFAULT_SETTINGS);
  });

  it('lets an administrator save, and reports a too-long notice on its field', async () => {
    const admin = await makeUser('Admin', 'settings');
    await setUserAdmin(admin.userId, true);
    const tooLong = await runWithRequest(buildRequest(admin), () => saveSettingsAction(null, form(true, 'x'.repeat(501))));
    expect(tooLong).toMatchObject({ ok: false, field: 'signInNotice' });
    // Outside the Next runtime the final revalidatePath() throws; the save before it has happened.
    await expect(
      runWithRequest(buildRequest(admin), () => saveSettingsAction(null, form(false, 'Quiet hours tonight.'))),
    ).rejects.toThrow(/static generation store/);
    expect(await getInstanceSettings()).toEqual({ openSignUp: false, signInNotice: 'Quiet hours tonight.' });
  });
});
