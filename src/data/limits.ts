/** Upload limits, configurable through the environment. */
import { settings } from '@/src/settings';

export { formatBytes } from '@/src/server/body-limit';

/** Largest accepted upload in bytes: UPLOAD_MAX_MB (default 200 MB). */
export function maxUploadBytes(): number {
  return Math.round(settings().UPLOAD_MAX_MB * 1024 * 1024);
}
