/**
 * Interval reading and flagging for people (routes and pages).
 */
import * as repo from '@/db/repo/intervals';
import { notFound } from '@/src/server/errors';

export async function getIntervalDetail(networkId: string, intervalId: string) {
  const [summary] = await repo.listIntervals({ networkId, intervalIds: [intervalId], includeFlagged: true });
  if (!summary) throw notFound('No such interval in this network.');
  const [spectrum] = await repo.getIntervalSpectra({ networkId, intervalIds: [intervalId], includeFlagged: true });
  return {
    ...summary,
    spectrum: spectrum ? { frequencies: spectrum.frequencies, power: spectrum.power, segments: spectrum.segments } : null,
  };
}

/** Flags (with a reason) or clears the flag of one interval. */
export async function flagInterval(
  networkId: string,
  intervalId: string,
  userId: string,
  flag: { flagged: boolean; reason?: string },
) {
  const out = await repo.setIntervalFlag(networkId, intervalId, flag.flagged ? { reason: flag.reason ?? '', userId } : null);
  if (!out) throw notFound('No such interval in this network.');
  return out;
}

export const listIntervals = repo.listIntervals;
export const getIntervalSpectra = repo.getIntervalSpectra;

/** Spectra cut to a frequency band (keeps responses small for the day views). */
export async function daySpectra(filter: repo.IntervalFilter, minHz: number, maxHz: number) {
  const rows = await repo.getIntervalSpectra({ ...filter, limit: filter.limit ?? 3 * 24 * 6 * 2 });
  return rows.map((s) => {
    let lo = 0;
    while (lo < s.frequencies.length && s.frequencies[lo] < minHz) lo++;
    let hi = lo;
    while (hi < s.frequencies.length && s.frequencies[hi] <= maxHz) hi++;
    return { ...s, frequencies: s.frequencies.slice(lo, hi), power: s.power.slice(lo, hi) };
  });
}

export const listStationDays = repo.listStationDays;
