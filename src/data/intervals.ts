/**
 * Interval reading and flagging for people (routes and pages).
 */
import * as repo from '@/db/repo/intervals';
import { notFound } from '@/src/server/errors';

export async function getIntervalDetail(networkId: string, intervalId: string) {
  const [summary] = await repo.listIntervals({ networkId, intervalIds: [intervalId], includeFlagged: true });
  if (!summary) throw notFound('No such interval in this network.');
  const [spectrum] = await repo.getIntervalSpectra({ networkId, intervalIds: [intervalId], includeFlagged: true });
  return { ...summary, spectrum: spectrum ? { frequencies: spectrum.frequencies, power: spectrum.power, segments: spectrum.segments } : null };
}

/** Flags (with a reason) or clears the flag of one interval. */
export async function flagInterval(networkId: string, intervalId: string, userId: string, flag: { flagged: boolean; reason?: string }) {
  const out = await repo.setIntervalFlag(networkId, intervalId,
    flag.flagged ? { reason: flag.reason ?? '', userId } : null);
  if (!out) throw notFound('No such interval in this network.');
  return out;
}

export const listIntervals = repo.listIntervals;
export const getIntervalSpectra = repo.getIntervalSpectra;
