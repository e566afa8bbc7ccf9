/**
 * Instance settings edited by site administrators: whether anyone may create
 * an account without an invitation, and a notice shown on the sign-in page.
 */
import { z } from 'zod';
import { readSettings, writeSettings } from '@/db/repo/users';

export const instanceSettingsSchema = z.object({
  openSignUp: z.boolean({ error: 'openSignUp must be true or false.' }),
  signInNotice: z.string().trim().max(500, { error: 'Keep the sign-in notice to 500 characters or fewer.' }),
});
export type InstanceSettings = z.infer<typeof instanceSettingsSchema>;

export const DEFAULT_SETTINGS: InstanceSettings = { openSignUp: true, signInNotice: '' };

export async function getInstanceSettings(): Promise<InstanceSettings> {
  const stored = await readSettings();
  const parsed = instanceSettingsSchema.partial().safeParse(stored);
  return { ...DEFAULT_SETTINGS, ...(parsed.success ? parsed.data : {}) };
}

export async function saveInstanceSettings(values: InstanceSettings): Promise<InstanceSettings> {
  await writeSettings(instanceSettingsSchema.parse(values));
  return getInstanceSettings();
}
