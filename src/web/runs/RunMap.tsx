'use client';
/**
 * The best (or selected) minimum on the world map: cell regions shaded by intensity on the activity
 * ramp of the design tokens (logarithmic, with a labelled colour bar), moving regions with their
 * spread (dashed circle) and the joint 68 % and 95 % confidence ellipses of their centre (Δχ² = 2.30
 * and 6.18 for two parameters) drawn as outlines over the marker, enlarged by a stated factor when they
 * would be too small to see; stations marked by fit quality, and stations without data for the
 * interval marked as such.
 *
 * The outline is drawn on the server (`RunMapFrame`, a `WorldFrame`); `RunMap` hands the selection to
 * the overlay inside it (`RunMapLayer`) through context, so choosing a minimum redraws only the overlay.
 */
import { createContext, useContext, useMemo, type ReactNode } from 'react';
import { geoCircle, geoPath } from 'd3-geo';
import { RAMPS } from '@/src/design/tokens';
import { ColourBar } from '@/src/web/charts/ColourBar';
import { formatMeasured, formatValue } from '@/src/web/ui/format';
import { JOINT_2D } from '@/src/runs/confidence';
import { extentOf, magnification } from '@/src/web/map/magnify';
import { MAP_SIZE } from './map-size';
import { makeProjection } from '@/src/web/map/projection';
import { cellPath } from '@/src/web/map/RegionShapes';
import type { Region } from '@/src/runs/grid-spec';
import { covarianceEllipse } from '@/src/runs/ellipse';
import { sharedLogRange } from '@/src/runs/compare';
import { centreCovariance, type Minimum } from './types';

export interface StationMark {
  station: string;
  lat: number;
  lon: number;
  /** Chi-square per bin of the station's fit; null/NaN when it had no data in this interval. */
  chi2PerBin: number | null;
  bins?: number;
}

const hasData = (st: StationMark) => (st.bins ?? 1) > 0 && st.chi2PerBin !== null && Number.isFinite(st.chi2PerBin);
/** Ramp part used for shading (the palest end would vanish on the map's land colour). */
const RAMP_PART: [number, number] = [0.15, 1];
const SUP: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** Colour-bar ticks over a log10 range: whole decades when it spans one, else its ends and middle. */
export function logTicks(lo: number, hi: number): { at: number; text: string }[] {
  const decades: number[] = [];
  for (let k = Math.ceil(lo - 1e-9); k <= hi + 1e-9; k++) decades.push(k);
  if (decades.length >= 2) return decades.map((k) => ({ at: k, text: `10${String(k).replace(/./g, (c) => SUP[c])}` }));
  return [lo, (lo + hi) / 2, hi].map((v) => ({ at: v, text: formatMeasured(10 ** v, null, '', 2) }));
}

/** Enlargement shared by every ellipse of the minimum: the least that makes the smallest 95 % ellipse visible. */
function ellipseMagnification(
  minimum: Minimum | null,
  regions: Region[],
  project: (p: [number, number]) => [number, number] | null,
): number {
  if (!minimum) return 1;
  let m = 1;
  for (const r of regions) {
    const s = minimum.sources.find((x) => x.name === r.name);
    const cov = r.kind === 'moving' && s ? centreCovariance(minimum, r.name) : null;
    if (!s || !cov) continue;
    const ring = covarianceEllipse(s, cov.sLat, cov.sLon, cov.rho, Math.sqrt(JOINT_2D[1].deltaChi2), 24);
    const px = ring.map((p) => project(p)).filter((p): p is [number, number] => p !== null);
    m = Math.max(m, magnification(extentOf(px)));
  }
  return m;
}

type LogRange = { lo: number; hi: number };

export interface RunMapState {
  regions: Region[];
  cellSizeDeg: number;
  minimum: Minimum | null;
  stations: StationMark[];
  /** A log10 intensity range shared with other maps (compare page); default the minimum's own. */
  logRange?: LogRange | null;
}

const Selection = createContext<(RunMapState & { magnified: number }) | null>(null);

function shade(t: number): string {
  return RAMPS.activity(RAMP_PART[0] + (RAMP_PART[1] - RAMP_PART[0]) * Math.min(1, Math.max(0, t)));
}

/**
 * log10 intensity range (the minimum's sources, or `range` when several maps share one scale) and
 * the position of one intensity in it (0..1).
 */
function intensityScale(minimum: Minimum | null, range?: LogRange | null) {
  const { lo, hi } = range ?? sharedLogRange([minimum]) ?? { lo: 0, hi: 1 };
  return { lo, hi, t: (I: number) => (hi > lo ? (Math.log10(Math.max(1, I)) - lo) / (hi - lo) : 0.7) };
}

/** The map (`frame`, from the server, with a `RunMapLayer` inside) and its legend. */
export function RunMap({ frame, regions, cellSizeDeg, minimum, stations, logRange }: RunMapState & { frame: ReactNode }) {
  const { lo, hi } = intensityScale(minimum, logRange);
  const magnified = useMemo(() => {
    const projection = makeProjection(MAP_SIZE.width, MAP_SIZE.height); // the frame's own drawing size
    return ellipseMagnification(minimum, regions, (p) => projection(p) as [number, number] | null);
  }, [minimum, regions]);
  const state = useMemo(
    () => ({ regions, cellSizeDeg, minimum, stations, magnified, logRange }),
    [regions, cellSizeDeg, minimum, stations, magnified, logRange],
  );
  const noData = stations.filter((st) => !hasData(st)).length;
  return (
    <div>
      <Selection.Provider value={state}>{frame}</Selection.Provider>
      {minimum?.sources.length ? (
        <ColourBar
          ramp={RAMPS.activity}
          domain={[lo, hi]}
          range={RAMP_PART}
          ticks={logTicks(lo, hi)}
          label="Intensity (C² km²/s), logarithmic"
        />
      ) : null}
      <p className="mt-1 text-xs text-muted">
        Moving regions: dashed circle = the region’s spread; ellipses = joint 68 % (solid) and 95 % (dotted) confidence regions of
        the centre (Δχ² = 2.30 and 6.18)
        {magnified > 1 ? <strong className="text-fg">, drawn enlarged ×{magnified} to be visible</strong> : null}. Squares:
        stations, filled violet when chi-square per bin ≤ 2, red above
        {noData ? `; hollow crossed squares: ${noData} station${noData === 1 ? '' : 's'} without data in this interval` : ''}.
      </p>
    </div>
  );
}

/** Regions, centres, ellipses and stations of the selected minimum, in the frame's projection. */
export function RunMapLayer({ width, height }: { width: number; height: number }) {
  const state = useContext(Selection);
  const projection = useMemo(() => makeProjection(width, height), [width, height]);
  if (!state) return null;
  const { regions, cellSizeDeg, minimum, stations, magnified, logRange } = state;
  const byName = new Map((minimum?.sources ?? []).map((s) => [s.name, s]));
  const { t } = intensityScale(minimum, logRange);
  const path = geoPath(projection);
  return (
    <>
      {regions.map((r) => {
        const s = byName.get(r.name);
        if (r.kind === 'cells') {
          return r.cells.map((c) => {
            const d = cellPath(path, cellSizeDeg, c);
            return (
              <path
                key={`${r.key}-${c}`}
                d={d}
                fill={s ? shade(t(s.intensity)) : 'none'}
                fillOpacity={0.85}
                stroke={r.colour}
                strokeWidth={0.6}
              >
                <title>{`${r.name}: ${s ? formatValue(s.intensity, 'C² km²/s') : 'not estimated'}`}</title>
              </path>
            );
          });
        }
        if (!s) return null;
        const cov = minimum ? centreCovariance(minimum, r.name) : null;
        const [x, y] = projection([s.lon, s.lat]) ?? [0, 0];
        const spread = r.spreadDeg > 0 ? path(geoCircle().center([s.lon, s.lat]).radius(r.spreadDeg)()) : null;
        return (
          <g key={r.key}>
            {spread ? (
              <path
                d={spread}
                fill={shade(t(s.intensity))}
                fillOpacity={0.25}
                stroke={r.colour}
                strokeWidth={1}
                strokeDasharray="4 3"
              >
                <title>{`${r.name}: spread ${r.spreadDeg}° around the centre`}</title>
              </path>
            ) : null}
            <circle cx={x} cy={y} r={5} fill={shade(t(s.intensity))} stroke={r.colour} strokeWidth={2}>
              <title>{`${r.name}: ${formatMeasured(s.intensity, minimum?.stdErrors[r.name]?.intensity, 'C² km²/s')} at ${s.lat.toFixed(2)}°, ${s.lon.toFixed(2)}°`}</title>
            </circle>
            {cov
              ? JOINT_2D.map((level, k) => {
                  const ring = covarianceEllipse(
                    s,
                    cov.sLat * magnified,
                    cov.sLon * magnified,
                    cov.rho,
                    Math.sqrt(level.deltaChi2),
                  );
                  const d = path({ type: 'Polygon', coordinates: [ring.reverse()] }) ?? '';
                  return (
                    <g key={level.label}>
                      {/* a pale halo under the outline keeps it visible over the marker and any shading */}
                      <path d={d} fill="none" stroke="var(--c-surface)" strokeWidth={3.5} />
                      <path d={d} fill="none" stroke={r.colour} strokeWidth={1.5} strokeDasharray={k ? '1.5 2.5' : undefined}>
                        <title>{`${r.name}: ${level.label} joint confidence region of the centre${magnified > 1 ? ` (drawn ×${magnified})` : ''}`}</title>
                      </path>
                    </g>
                  );
                })
              : null}
          </g>
        );
      })}
      {stations.map((st) => {
        const [x, y] = projection([st.lon, st.lat]) ?? [0, 0];
        const data = hasData(st);
        const good = data && (st.chi2PerBin as number) <= 2;
        return (
          <g key={st.station} transform={`translate(${x},${y})`}>
            {data ? (
              <rect
                x={-5}
                y={-5}
                width={10}
                height={10}
                className={good ? 'fill-accent' : 'fill-danger'}
                stroke="var(--c-surface)"
                strokeWidth={1}
              />
            ) : (
              <>
                <rect x={-5} y={-5} width={10} height={10} fill="var(--c-surface)" stroke="var(--c-muted)" strokeWidth={1.25} />
                <path d="M-5,-5L5,5M-5,5L5,-5" stroke="var(--c-muted)" strokeWidth={1.25} />
              </>
            )}
            <text x={8} y={4} fontSize={11} className={data ? 'fill-fg' : 'fill-muted'}>
              {data ? st.station : `${st.station} (no data)`}
            </text>
            <title>
              {data
                ? `${st.station}: chi-square per bin ${formatMeasured(st.chi2PerBin)}`
                : `${st.station}: no data in this interval`}
            </title>
          </g>
        );
      })}
    </>
  );
}
