/** What the day view reads from the intervals API, and the display units it draws in. */
import type { IntervalSpectrum, IntervalSummary } from '@/db/repo/intervals';
import { COMPONENT_INFO, type Component } from '@/src/engine/components';
import { displayFactor } from '@/src/engine/forward/units';

/** A value as it arrives over JSON: its dates are ISO strings. */
type OverJson<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K] };

export type Interval = OverJson<IntervalSummary>;
export type Spectrum = OverJson<IntervalSpectrum>;

/** Which intervals the table lists. */
export type IntervalFilter = 'all' | 'clean' | 'quality' | 'flagged';

/** SI power in the display units of a component ((mV/m)^2/Hz for Ez, pT^2/Hz for the coils). */
export function toDisplayPower(component: string, p: number): number {
  return p * displayFactor(component as Component);
}

export function displayUnit(component: string): string {
  return COMPONENT_INFO[component as Component].displayUnit;
}

/** The day's UTC clock on a time axis, the axis label centred under the ticks. */
export function dayAxis(dayStart: number) {
  return {
    type: 'utc' as const,
    domain: [new Date(dayStart), new Date(dayStart + 86_400_000)],
    tickFormat: '%H:%M',
    labelAnchor: 'center' as const,
    labelOffset: 34,
  };
}
