/** Upload limits, configurable through the environment. */
import { settings } from '@/src/settings';

export { formatBytes } from '@/src/server/body-limit';

/** Largest accepted upload in bytes: UPLOAD_MAX_MB (default 200 MB). */
export function maxUploadBytes(): number {
  return Math.round(settings().UPLOAD_MAX_MB * 1024 * 1024);
}

/** Sample times a station may send: from SAMPLE_EARLIEST (a UTC day) to SAMPLE_AHEAD_HOURS past the server's clock. */
export function sampleWindow(now = Date.now()): { earliestMs: number; latestMs: number; text: string } {
  const s = settings();
  const earliestMs = Date.parse(`${s.SAMPLE_EARLIEST}T00:00:00Z`);
  const latestMs = now + s.SAMPLE_AHEAD_HOURS * 3_600_000;
  return {
    earliestMs,
    latestMs,
    text: `from ${s.SAMPLE_EARLIEST} to ${s.SAMPLE_AHEAD_HOURS} h past the server's clock (${new Date(latestMs).toISOString().slice(0, 16)}Z)`,
  };
}

/** Why a sample time lies outside `sampleWindow()`, or null when it is inside. */
export function outsideSampleWindow(ms: number, now = Date.now()): string | null {
  const w = sampleWindow(now);
  if (ms >= w.earliestMs && ms <= w.latestMs) return null;
  return `${new Date(ms).toISOString()} lies outside the accepted sample dates, ${w.text}; check the station clock`;
}
