/**
 * A labelled colour bar (SVG attributes only, no inline CSS) for figures drawn outside Observable
 * Plot, such as the run map: the ramp as a gradient, tick marks with numbers, and a label with the
 * unit. `ticks` are positions in the bar's own value space (e.g. log10 intensity) with their text.
 */
import { useId } from 'react';
import type { Ramp } from '@/src/design/tokens';

export interface ColourBarProps {
  ramp: Ramp;
  /** Value range shown, in the same space as the ticks; [lo, hi] maps to ramp positions [from, to]. */
  domain: [number, number];
  /** Part of the ramp used (default the whole of it). */
  range?: [number, number];
  ticks: { at: number; text: string }[];
  label: string;
  width?: number;
}

export function ColourBar({ ramp, domain, range = [0, 1], ticks, label, width = 320 }: ColourBarProps) {
  const id = useId().replace(/:/g, '');
  const [lo, hi] = domain;
  const x = (v: number) => 8 + ((v - lo) / (hi - lo || 1)) * (width - 16);
  const stops = Array.from({ length: 17 }, (_, i) => i / 16);
  return (
    <svg
      role="img"
      aria-label={`Colour bar: ${label}, from ${ticks[0]?.text ?? ''} to ${ticks.at(-1)?.text ?? ''}`}
      viewBox={`0 0 ${width} 46`}
      width={width}
      height={46}
      className="block max-w-full overflow-visible font-sans text-fg"
    >
      <defs>
        <linearGradient id={`bar-${id}`}>
          {stops.map((t) => (
            <stop key={t} offset={t} stopColor={ramp(range[0] + t * (range[1] - range[0]))} />
          ))}
        </linearGradient>
      </defs>
      <text x={8} y={10} fontSize={11} fill="currentColor">
        {label}
      </text>
      <rect x={8} y={16} width={width - 16} height={10} fill={`url(#bar-${id})`} stroke="currentColor" strokeWidth={0.5} />
      {ticks.map((t) => (
        <g key={t.at} transform={`translate(${x(t.at)},0)`}>
          <line y1={22} y2={30} stroke="currentColor" strokeWidth={0.75} />
          <text y={41} fontSize={10} textAnchor="middle" fill="currentColor" className="num">
            {t.text}
          </text>
        </g>
      ))}
    </svg>
  );
}
