/**
 * Shapes shared by the run services, the worker jobs and the run pages.
 * Engine results are stored as plain JSON on `run_intervals.result`.
 */
import type { CavityConfig } from '@/src/engine/cavity/types';
import type { ObservedSeries as EngineObservedSeries } from '@/src/engine/inverse/types';
import type { RunConfig } from './config';
import type { Region } from './grid-spec';

/**
 * One observed series of one interval as a run keeps it: the engine's observed series in plain
 * arrays (stored as JSON), with the sigma of ln(power) always given.
 */
export type ObservedSeries = Omit<EngineObservedSeries, 'frequencies' | 'power' | 'sigmaLog'> & {
  frequencies: number[];
  power: number[];
  sigmaLog: number;
};

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
