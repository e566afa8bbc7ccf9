'use client';
/**
 * The best (or selected) minimum on the world map: cell regions shaded by
 * intensity on the activity ramp of the design tokens (lightness falls
 * monotonically with intensity), moving centres with 1- and 2-sigma ellipses from their
 * lat/lon covariance, stations marked by their fit quality (chi-square per bin).
 *
 * The outline is drawn on the server (`RunMapFrame`, a `WorldFrame`); `RunMap`
 * hands the selection to the overlay inside it (`RunMapLayer`) through context,
 * so choosing a minimum redraws only the overlay.
 */
import { createContext, useContext, useMemo, type ReactNode } from 'react';
import { geoPath } from 'd3-geo';
import { RAMPS } from '@/src/design/tokens';
import { makeProjection } from '@/src/web/map/projection';
import { cellBox } from '@/src/runs/grid-cells';
import type { Region } from '@/src/runs/grid-spec';
import { covarianceEllipse } from '@/src/runs/ellipse';
import { centreCovariance, fmt, type Minimum } from './types';

export interface StationMark {
  station: string;
  lat: number;
  lon: number;
  chi2PerBin: number;
}

export interface RunMapState {
  regions: Region[];
  cellSizeDeg: number;
  minimum: Minimum | null;
  stations: StationMark[];
}

const Selection = createContext<RunMapState | null>(null);

function shade(t: number): string {
  return RAMPS.activity(0.15 + 0.85 * Math.min(1, Math.max(0, t)));
}

/** log10 intensity range of the minimum's sources and the position of one intensity in it (0..1). */
function intensityScale(minimum: Minimum | null) {
  const values = (minimum?.sources ?? []).map((s) => Math.log10(Math.max(1, s.intensity)));
  const lo = values.length ? Math.min(...values) : 0;
  const hi = values.length ? Math.max(...values) : 1;
  return { lo, hi, t: (I: number) => (hi > lo ? (Math.log10(Math.max(1, I)) - lo) / (hi - lo) : 0.7) };
}

/** The map (`frame`, from the server, with a `RunMapLayer` inside) and its legend. */
export function RunMap({ frame, regions, cellSizeDeg, minimum, stations }: RunMapState & { frame: ReactNode }) {
  const state = useMemo(() => ({ regions, cellSizeDeg, minimum, stations }), [regions, cellSizeDeg, minimum, stations]);
  const { lo, hi } = intensityScale(minimum);
  return (
    <div>
      <Selection.Provider value={state}>{frame}</Selection.Provider>
      <p className="mt-1 text-xs text-muted">
        Shading: intensity on a logarithmic scale, pale to dark, from {fmt(10 ** lo)} to {fmt(10 ** hi)} C² km²/s. Ellipses: 1σ
        (solid fill) and 2σ (dashed) of the centre. Squares: stations, violet when chi-square per bin ≤ 2, red otherwise.
      </p>
    </div>
  );
}

/** Regions, centres, ellipses and stations of the selected minimum, in the frame's projection. */
export function RunMapLayer({ width, height }: { width: number; height: number }) {
  const state = useContext(Selection);
  const projection = useMemo(() => makeProjection(width, height), [width, height]);
  if (!state) return null;
  const { regions, cellSizeDeg, minimum, stations } = state;
  const byName = new Map((minimum?.sources ?? []).map((s) => [s.name, s]));
  const { t } = intensityScale(minimum);
  const path = geoPath(projection);
  return (
    <>
      {regions.map((r) => {
        const s = byName.get(r.name);
        if (r.kind === 'cells') {
          return r.cells.map((c) => {
            const b = cellBox(cellSizeDeg, c);
            const d = path({
              type: 'Polygon',
              coordinates: [
                [
                  [b.west, b.south],
                  [b.west, b.north],
                  [b.east, b.north],
                  [b.east, b.south],
                  [b.west, b.south],
                ],
              ],
            });
            return (
              <path
                key={`${r.key}-${c}`}
                d={d ?? ''}
                fill={s ? shade(t(s.intensity)) : 'none'}
                fillOpacity={0.85}
                stroke={r.colour}
                strokeWidth={0.6}
              >
                <title>{`${r.name}: ${s ? fmt(s.intensity) + ' C² km²/s' : 'not estimated'}`}</title>
              </path>
            );
          });
        }
        if (!s) return null;
        const cov = minimum ? centreCovariance(minimum, r.name) : null;
        const [x, y] = projection([s.lon, s.lat]) ?? [0, 0];
        return (
          <g key={r.key}>
            {cov
              ? [2, 1].map((k) => (
                  <path
                    key={k}
                    d={
                      path({ type: 'Polygon', coordinates: [covarianceEllipse(s, cov.sLat, cov.sLon, cov.rho, k).reverse()] }) ??
                      ''
                    }
                    fill={shade(t(s.intensity))}
                    fillOpacity={k === 1 ? 0.45 : 0.2}
                    stroke={r.colour}
                    strokeDasharray={k === 2 ? '3 2' : undefined}
                  />
                ))
              : null}
            <circle cx={x} cy={y} r={5} fill={shade(t(s.intensity))} stroke={r.colour} strokeWidth={2}>
              <title>{`${r.name}: ${fmt(s.intensity)} C² km²/s at ${s.lat.toFixed(2)}°, ${s.lon.toFixed(2)}°`}</title>
            </circle>
          </g>
        );
      })}
      {stations.map((st) => {
        const [x, y] = projection([st.lon, st.lat]) ?? [0, 0];
        const good = st.chi2PerBin <= 2;
        return (
          <g key={st.station} transform={`translate(${x},${y})`}>
            <rect
              x={-5}
              y={-5}
              width={10}
              height={10}
              className={good ? 'fill-accent' : 'fill-danger'}
              stroke="white"
              strokeWidth={1}
            />
            <text x={8} y={4} fontSize={11} className="fill-fg">
              {st.station}
            </text>
            <title>{`${st.station}: chi-square per bin ${fmt(st.chi2PerBin)}`}</title>
          </g>
        );
      })}
    </>
  );
}
