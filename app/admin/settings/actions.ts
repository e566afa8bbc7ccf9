'use server';
import { revalidatePath } from 'next/cache';
import { requireAdmin } from '@/src/auth/permissions';
import { instanceSettingsSchema, saveInstanceSettings } from '@/src/auth/settings';
import { AppError } from '@/src/server/errors';

export interface SettingsState {
  ok: boolean;
  message: string;
  field?: string;
}

/** Save instance settings (administrators only). */
export async function saveSettingsAction(_prev: SettingsState | null, form: FormData): Promise<SettingsState> {
  try {
    await requireAdmin();
    const parsed = instanceSettingsSchema.safeParse({
      openSignUp: form.get('openSignUp') === 'on',
      signInNotice: String(form.get('signInNotice') ?? ''),
    });
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      return { ok: false, message: issue.message, field: issue.path.join('.') };
    }
    await saveInstanceSettings(parsed.data);
    revalidatePath('/admin/settings');
    return { ok: true, message: 'Settings saved.' };
  } catch (e) {
    if (e instanceof AppError) return { ok: false, message: e.message };
    throw e;
  }
}
