'use client';
/** Misfit surface over two chosen parameters around the selected minimum, computed by the worker on request and cached. */
import { useMemo, useState } from 'react';
import type * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { PlotModule } from '@/src/web/charts/plot-module';
import { RAMPS } from '@/src/design/tokens';
import { JOINT_2D, deltaChi2Contours } from '@/src/runs/confidence';
import { Button } from '@/src/web/ui/Button';
import { Notice } from '@/src/web/ui/Notice';
import { apiSend, useApi } from '@/src/web/swr';

type Surface = {
  id: string;
  state: 'queued' | 'running' | 'ready' | 'failed';
  error: string | null;
  result: {
    xName: string;
    yName: string;
    x: number[];
    y: number[];
    misfit: number[][];
    centre: { x: number; y: number; misfit: number };
  } | null;
};

const unit = (n: string) => (n.endsWith('.intensity') ? `${n} (C² km²/s)` : `${n} (°)`);

export function SurfacePanel({
  base,
  interval,
  minimum,
  paramNames,
  canRequest,
}: {
  base: string;
  interval: string;
  minimum: number;
  paramNames: string[];
  canRequest: boolean;
}) {
  const [x, setX] = useState(paramNames[0] ?? '');
  const [y, setY] = useState(paramNames[1] ?? paramNames[0] ?? '');
  const [mode, setMode] = useState<'fixed' | 'profile'>('fixed');
  const [id, setId] = useState<string | null>(null);
  const [err, setErr] = useState<string | null>(null);
  const { data } = useApi<{ surface: Surface }>(id ? `${base}/surfaces/${id}` : null, {
    refreshInterval: (d) => (d && (d.surface.state === 'ready' || d.surface.state === 'failed') ? 0 : 1000),
  });
  const s = data?.surface;
  const options = useMemo(() => {
    if (!s?.result) return null;
    const r = s.result;
    const logX = r.xName.endsWith('.intensity');
    const logY = r.yName.endsWith('.intensity');
    // Cell edges half-way between grid values (geometric half-way on a log axis).
    const edges = (v: number[], log: boolean) => {
      const mid = (a: number, b: number) => (log ? Math.sqrt(a * b) : (a + b) / 2);
      return v.map((x, i) => [
        i > 0 ? mid(v[i - 1], x) : log ? x / Math.sqrt(v[1] / x) : x - (v[1] - x) / 2,
        i < v.length - 1 ? mid(x, v[i + 1]) : log ? x * Math.sqrt(x / v[i - 1]) : x + (x - v[i - 1]) / 2,
      ]);
    };
    const ex = edges(r.x, logX);
    const ey = edges(r.y, logY);
    const least = Math.min(r.centre.misfit, ...r.misfit.flat().filter(Number.isFinite));
    const cells = r.y.flatMap((yv, j) =>
      r.x.map((xv, i) => ({
        x1: ex[i][0],
        x2: ex[i][1],
        y1: ey[j][0],
        y2: ey[j][1],
        m: r.misfit[j][i],
        d: r.misfit[j][i] - least,
      })),
    );
    // Joint 68 % and 95 % regions of the two parameters (Delta chi2 = 2.30, 6.18), one line per ring.
    const lines = deltaChi2Contours(
      { ...r, minimum: r.centre.misfit },
      JOINT_2D.map((l) => l.deltaChi2),
      { x: logX, y: logY },
    ).flatMap((c, k) =>
      c.rings.flatMap((ring, n) => ring.map(([px, py]) => ({ x: px, y: py, ring: `${k}-${n}`, level: JOINT_2D[k].label }))),
    );
    return (Plot: PlotModule) =>
      ({
        x: logX ? { type: 'log' } : {},
        y: logY ? { type: 'log' } : {},
        color: {
          type: 'linear',
          interpolate: RAMPS.depth,
          legend: true,
          label: `Δχ² above the minimum χ² = ${least.toPrecision(6)} (dimensionless)`,
        },
        marks: [
          Plot.rect(cells, {
            x1: 'x1',
            x2: 'x2',
            y1: 'y1',
            y2: 'y2',
            fill: 'd',
            title: (d: { m: number; d: number }) => `χ² = ${d.m.toPrecision(6)} (Δχ² = ${d.d.toPrecision(3)})`,
          }),
          // each contour twice, a dark line under a white one, so it reads on every cell of the ramp
          Plot.line(lines, { x: 'x', y: 'y', z: 'ring', stroke: '#000000', strokeWidth: 3, strokeOpacity: 0.6 }),
          ...JOINT_2D.map((l, k) =>
            Plot.line(
              lines.filter((p) => p.level === l.label),
              { x: 'x', y: 'y', z: 'ring', stroke: '#ffffff', strokeWidth: 1.25, strokeDasharray: k ? '5 3' : undefined },
            ),
          ),
          Plot.dot([r.centre], { x: 'x', y: 'y', r: 5, stroke: 'white', strokeWidth: 2, symbol: 'cross' }),
        ],
      }) as unknown as Plot.PlotOptions;
  }, [s]);
  async function ask() {
    setErr(null);
    try {
      const res = await apiSend<{ surface: Surface }>('POST', `${base}/surfaces`, { interval, minimum, x, y, mode });
      setId(res.surface.id);
    } catch (e) {
      setErr((e as Error).message);
    }
  }
  if (paramNames.length < 2) return <p className="text-sm text-muted">A misfit surface needs at least two free parameters.</p>;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <label>
          Horizontal{' '}
          <select
            aria-label="Horizontal parameter"
            className="ml-1 rounded border border-line-strong bg-surface px-2 py-1"
            value={x}
            onChange={(e) => setX(e.target.value)}
          >
            {paramNames.map((n) => (
              <option key={n}>{n}</option>
            ))}
          </select>
        </label>
        <label>
          Vertical{' '}
          <select
            aria-label="Vertical parameter"
            className="ml-1 rounded border border-line-strong bg-surface px-2 py-1"
            value={y}
            onChange={(e) => setY(e.target.value)}
          >
            {paramNames.map((n) => (
              <option key={n}>{n}</option>
            ))}
          </select>
        </label>
        <label>
          Others{' '}
          <select
            aria-label="Other parameters"
            className="ml-1 rounded border border-line-strong bg-surface px-2 py-1"
            value={mode}
            onChange={(e) => setMode(e.target.value as 'fixed' | 'profile')}
          >
            <option value="fixed">held at the minimum</option>
            <option value="profile">re-minimised (profile)</option>
          </select>
        </label>
        <Button type="button" onClick={ask} disabled={!canRequest || x === y}>
          Map the misfit
        </Button>
        {!canRequest ? <span className="text-muted">Analysts and owners can ask for a surface.</span> : null}
      </div>
      {err ? (
        <Notice tone="error" title="The surface was not requested">
          {err}
        </Notice>
      ) : null}
      {s && s.state !== 'ready' && s.state !== 'failed' ? (
        <p role="status" className="text-sm text-muted">
          The worker is computing the surface ({s.state})…
        </p>
      ) : null}
      {s?.state === 'failed' ? (
        <Notice tone="error" title="The surface failed">
          {s.error}. Ask again to retry.
        </Notice>
      ) : null}
      {options && s?.result ? (
        <PlotFigure
          title={`Misfit over ${s.result.xName} and ${s.result.yName}`}
          xLabel={unit(s.result.xName)}
          yLabel={unit(s.result.yName)}
          caption={`${s.result && (s.result as { mode?: string }).mode === 'profile' ? 'Other parameters re-minimised at each point' : 'Other parameters held at the minimum'}; the cross marks the minimum; ±3 standard errors around it. Contours: joint 68 % (solid) and 95 % (dashed) regions of the two parameters, Δχ² = 2.30 and 6.18 (Press et al., Numerical Recipes §15.6).`}
          options={options}
          height={340}
        />
      ) : null}
    </div>
  );
}
