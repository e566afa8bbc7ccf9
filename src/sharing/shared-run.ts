/**
 * What a link holder may read: the one run the link names — its summary and
 * its intervals (map, minima with errors) and its fits — and nothing else.
 * Every read opens the token again, so a link revoked a moment ago reads nothing.
 */
import { getIntervalView, getRunSummary, type IntervalView, type RunView } from '@/src/runs/results';
import { fitsAt, type RunFits } from '@/src/runs/fits';
import { openingInterval } from '@/src/runs/view-select';
import { openLink, requireLink, type OpenedLink } from './links';

/** The shared run as the run API sends it first (a summary with the last solved interval whole). */
export async function sharedRunView(token: string): Promise<RunView> {
  const { networkId, runId } = await requireLink(token);
  return getRunSummary(networkId, runId);
}

/** One interval of the shared run, whole. */
export async function sharedRunInterval(token: string, startsAt: Date): Promise<IntervalView> {
  const { networkId, runId } = await requireLink(token);
  return getIntervalView(networkId, runId, startsAt);
}

export async function sharedRunFits(token: string, interval: string, minimum: number): Promise<RunFits> {
  const { networkId, runId } = await requireLink(token);
  return fitsAt(networkId, runId, interval, minimum);
}

export type SharedPage =
  Exclude<OpenedLink, { kind: 'open' }> | { kind: 'open'; view: RunView; fits: RunFits | null; expiresAt: string };

/** The shared page's first view: the summary, and the last solved interval with its best minimum's fits. */
export async function sharedRunPage(token: string): Promise<SharedPage> {
  const o = await openLink(token);
  if (o.kind !== 'open') return o;
  const view = await getRunSummary(o.networkId, o.runId);
  const open = openingInterval(view.intervals);
  const fits = open ? await fitsAt(o.networkId, o.runId, open.startsAt, 0).catch(() => null) : null;
  return { kind: 'open', view, fits, expiresAt: o.expiresAt.toISOString() };
}
