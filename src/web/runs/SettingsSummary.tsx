/** What a run asked for: data, observables, model, grid, regions and bounds, damping, starts, seed, engine version. */
import type { RunView } from '@/src/runs/results';
import { formatValue } from '@/src/web/ui/format';
import { ordinal } from '@/src/web/ui/format';

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[11rem_1fr] gap-2 py-1 text-sm">
      <dt className="text-muted">{label}</dt>
      <dd className="tabular-nums">{children}</dd>
    </div>
  );
}

export function SettingsSummary({ view, stationCodes, networkId }: { view: RunView; stationCodes: string[]; networkId: string }) {
  const { config, model, grid, run } = view;
  const o = config.observables;
  const m = model.config as { model: string; earthRadiusKm: number; heightKm: number; table?: { rows: unknown[] } };
  return (
    <dl className="divide-y divide-line/60">
      <Row label="Stations">
        {stationCodes.join(', ')} · {config.data.components.join(', ')}
      </Row>
      <Row label="Intervals (UT)">
        {config.data.from.slice(0, 16).replace('T', ' ')} – {config.data.to.slice(0, 16).replace('T', ' ')} ·{' '}
        {run.intervalStarts.length} with data · {config.data.includeFlagged ? 'flagged included' : 'unflagged only'}
      </Row>
      <Row label="Observables">
        {o.kind === 'spectrum'
          ? `log power, ${o.minHz}–${o.maxHz} Hz${o.every > 1 ? `, every ${ordinal(o.every)} bin` : ''}`
          : `peak power of the first ${o.modes} fitted modes`}
      </Row>
      <Row label="Cavity model">
        <a className="text-accent underline underline-offset-2" href={`/n/${networkId}/models/${model.id}`}>
          {model.name} v{model.version}
        </a>{' '}
        · {m.model}
        {m.table ? ` (${m.table.rows.length} rows)` : ''}, a = {m.earthRadiusKm} km, h = {m.heightKm} km
      </Row>
      <Row label="Source grid">
        <a className="text-accent underline underline-offset-2" href={`/n/${networkId}/grids/${grid.id}`}>
          {grid.name} v{grid.version}
        </a>{' '}
        · {grid.cellSizeDeg}° cells
      </Row>
      <Row label="Free parameters">
        <ul>
          {config.regions.map((u) => {
            const r = grid.regions.find((x) => x.key === u.region);
            return (
              <li key={u.region}>
                <span className="mr-1 inline-block size-2.5 rounded-sm align-middle" style={{ background: r?.colour }} />
                {r?.name ?? u.region}: intensity {formatValue(u.intensity.min)}–{formatValue(u.intensity.max)} C² km²/s
                {u.lat ? `, lat ${u.lat.min}…${u.lat.max}°` : ''}
                {u.lon ? `, lon ${u.lon.min}…${u.lon.max}°` : ''}
                {r?.kind === 'cells' ? ` (${r.cells.length} fixed cells)` : ''}
              </li>
            );
          })}
        </ul>
      </Row>
      <Row label="Damping">
        initial λ {config.damping.initialLambda}, at most {config.damping.maxIterations} iterations
      </Row>
      <Row label="Errors">
        <span data-testid="error-scaling">
          {view.errorsScaledByMisfit
            ? 'scaled by the misfit: × √(χ²/dof) of each minimum where above 1'
            : 'as stated (from the data’s σ, not scaled by the misfit)'}
        </span>
      </Row>
      <Row label="Starts / seed">
        {config.starts} / {config.seed}
      </Row>
      <Row label="Engine">{run.engineVersion}</Row>
      <Row label="Launched (UT)">{run.createdAt.slice(0, 19).replace('T', ' ')}</Row>
    </dl>
  );
}
