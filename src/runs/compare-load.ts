/**
 * What the compare page shows for two picks, each a run with one interval and
 * one of its minima (by default the last solved interval's best minimum): the
 * runs' summaries, the chosen minima, the settings side by side and the
 * parameter table (compare.ts). The two picks may name the same run.
 */
import { listStations } from '@/src/data/stations';
import type { Minimum } from '@/src/engine/inverse/types';
import { parameterComparison, settingsDiff, type ParameterRow, type SettingRow } from './compare';
import { getIntervalView, getRunSummary, type RunView } from './results';
import { solvedIntervals } from './view-select';

export interface Pick {
  runId: string;
  /** Interval start (ISO); default the last solved one. */
  interval?: string;
  /** Index of the minimum (0 = best). */
  minimum?: number;
}

export interface PickedMinimum {
  view: RunView;
  interval: string | null;
  index: number;
  minimum: Minimum | null;
  /** How many minima the chosen interval has. */
  minimaCount: number;
}

async function load(networkId: string, p: Pick): Promise<PickedMinimum> {
  const view = await getRunSummary(networkId, p.runId);
  const solved = solvedIntervals(view.intervals);
  const chosen = (p.interval && solved.find((i) => Date.parse(i.startsAt) === Date.parse(p.interval!))) || solved.at(-1);
  if (!chosen) return { view, interval: null, index: 0, minimum: null, minimaCount: 0 };
  const whole = chosen.brief ? await getIntervalView(networkId, p.runId, new Date(chosen.startsAt)) : chosen;
  const minima = whole.result?.minima ?? [];
  const index = Math.min(Math.max(0, p.minimum ?? 0), Math.max(0, minima.length - 1));
  return { view, interval: chosen.startsAt, index, minimum: minima[index] ?? null, minimaCount: minima.length };
}

export interface Comparison {
  a: PickedMinimum;
  b: PickedMinimum;
  settings: SettingRow[];
  parameters: ParameterRow[];
}

export async function loadComparison(networkId: string, a: Pick, b: Pick): Promise<Comparison> {
  const [pa, pb, stations] = await Promise.all([load(networkId, a), load(networkId, b), listStations(networkId)]);
  const code = (id: string) => stations.find((s) => s.id === id)?.code ?? 'removed station';
  return {
    a: pa,
    b: pb,
    settings: settingsDiff(pa.view, pb.view, code),
    parameters: pa.minimum && pb.minimum ? parameterComparison(pa.minimum, pb.minimum) : [],
  };
}
