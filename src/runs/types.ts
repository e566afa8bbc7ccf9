/**
 * Shapes shared by the run services, the worker jobs and the run pages.
 * Engine results are stored as plain JSON on `run_intervals.result`.
 */
import type { CavityConfig } from '@/src/engine/cavity/types';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';
import type { RunConfig } from './config';
import type { Region } from './grid-spec';

export type ComponentName = 'Ez' | 'Bns' | 'Bew';

/** One observed series of one interval: power in SI units, sigma of ln(power). */
export interface ObservedSeries {
  station: string;
  component: ComponentName;
  frequencies: number[];
  power: number[];
  sigmaLog: number;
  /** Welch statistics of the spectrum (imported case files may carry them; they then win over sigmaLog). */
  welch?: WelchStatistics;
}

export interface RunStation {
  id: string;
  code: string;
  lat: number;
  lon: number;
}

/** Everything a worker needs to solve any interval of a run, loaded once. */
export interface RunContext {
  runId: string;
  networkId: string;
  config: RunConfig;
  cavity: CavityConfig;
  grid: { cellSizeDeg: number; regions: Region[] };
  stations: RunStation[];
}

export interface IntervalCase {
  startsAt: string;
  observed: ObservedSeries[];
  modes?: import('@/src/engine/inverse/types').ObservedModes[];
}

export interface SolveHooks {
  /** Called after each finished start. */
  onStart(done: number, total: number): void;
  /** Polled between and within starts; true ends the solve early. */
  shouldStop(): boolean;
}

/** What one interval produced: the engine's result as JSON (minima best first) and the data count. */
export interface IntervalOutcome {
  nData: number;
  result: Record<string, unknown>;
}

/**
 * Solves one interval; resolves to 'cancelled' when shouldStop() cut it short. A solve that
 * completed although a stop was asked for meanwhile resolves to its (complete) result.
 */
export type IntervalSolver = (ctx: RunContext, c: IntervalCase, hooks: SolveHooks) => Promise<IntervalOutcome | 'cancelled'>;
