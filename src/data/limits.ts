/** Upload limits, configurable through the environment. */
import { settings } from '@/src/settings';

/** Largest accepted upload in bytes: UPLOAD_MAX_MB (default 200 MB). */
export function maxUploadBytes(): number {
  return Math.round(settings().UPLOAD_MAX_MB * 1024 * 1024);
}

export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(n >= 10 * 1024 * 1024 ? 0 : 1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(0)} kB`;
  return `${n} bytes`;
}
