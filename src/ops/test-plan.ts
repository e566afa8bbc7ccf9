/** Decisions of `npm test` that do not need a database (kept apart so they can be tested). */
import { settings } from '@/src/settings';

export const CHROMIUM = '/usr/bin/chromium';

/** Browser tests: run with chromium; without it, fail under CI (CI=true or 1), else skip loudly. */
export function browserPlan(env: Record<string, string | undefined>, chromiumExists: boolean): 'run' | 'skip' | 'fail' {
  if (chromiumExists) return 'run';
  return settings(env).CI ? 'fail' : 'skip';
}
