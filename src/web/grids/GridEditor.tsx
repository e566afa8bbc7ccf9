'use client';
/**
 * Draw a source grid: a global grid of a chosen cell size on the equal-area
 * world map, regions made of cells (click a cell, drag a box, or drag a box
 * keeping only land cells, from the engine's land mask), or moving regions
 * with a centre, bounds and spread. Names and colours (the design tokens' region colours) per region.
 * Overlaps, empty regions and centres outside bounds are shown before saving.
 */
import { useMemo, useRef, useState, type MouseEvent } from 'react';
import { useRouter } from 'next/navigation';
import { geoGraticule, geoPath, type GeoProjection } from 'd3-geo';
import { WorldMap } from '@/src/web/map/WorldMap';
import { RegionShapes, lonLatBox } from '@/src/web/map/RegionShapes';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { apiSend } from '@/src/web/swr';
import { REGION_COLOURS } from '@/src/design/tokens';
import { CELL_SIZES, cellAt, cellsInBox, gridProblems, type Region } from '@/src/runs/grid-spec';
import { makeGlobalGrid } from '@/src/engine/sources/grid';
import { landCellsInBox } from '@/src/engine/sources/land-mask';

type Tool = 'click' | 'box' | 'land';
const W = 900;
const H = 460;

function slug(name: string, taken: Set<string>): string {
  const base =
    name
      .toLowerCase()
      .normalize('NFKD')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 32) || 'region';
  let k = base;
  for (let i = 2; taken.has(k); i++) k = `${base}-${i}`;
  return k;
}

export interface GridEditorValue {
  name: string;
  notes: string;
  cellSizeDeg: number;
  regions: Region[];
}

export function GridEditor({ networkId, initial, baseId }: { networkId: string; initial?: GridEditorValue; baseId?: string }) {
  const router = useRouter();
  const [name, setName] = useState(initial?.name ?? '');
  const [notes, setNotes] = useState(initial?.notes ?? '');
  const [cell, setCell] = useState(initial?.cellSizeDeg ?? 10);
  const [regions, setRegions] = useState<Region[]>(initial?.regions ?? []);
  const [active, setActive] = useState(0);
  const [tool, setTool] = useState<Tool>('click');
  const [drag, setDrag] = useState<{ a: [number, number]; b: [number, number] } | null>(null);
  const projRef = useRef<GeoProjection | null>(null);
  const [serverError, setServerError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const problems = useMemo(() => {
    const p = gridProblems({ name, notes, cellSizeDeg: cell, regions });
    if (!name.trim()) p.unshift({ field: 'name', message: 'give the grid a name' });
    return p;
  }, [name, notes, cell, regions]);

  const update = (i: number, patch: Partial<Region>) =>
    setRegions((rs) => rs.map((r, k) => (k === i ? ({ ...r, ...patch } as Region) : r)));
  function addRegion(kind: 'cells' | 'moving') {
    const taken = new Set(regions.map((r) => r.key));
    const n = regions.length + 1;
    const nm = kind === 'cells' ? `Region ${n}` : `Moving region ${n}`;
    const colour = REGION_COLOURS[regions.length % REGION_COLOURS.length];
    const r: Region =
      kind === 'cells'
        ? { key: slug(nm, taken), name: nm, colour, kind: 'cells', cells: [] }
        : {
            key: slug(nm, taken),
            name: nm,
            colour,
            kind: 'moving',
            centre: { lat: 0, lon: 0 },
            bounds: { lat: { min: -20, max: 20 }, lon: { min: -20, max: 20 } },
            spreadDeg: 0,
          };
    setRegions([...regions, r]);
    setActive(regions.length);
  }
  function changeCellSize(d: number) {
    if (
      regions.some((r) => r.kind === 'cells' && r.cells.length) &&
      !confirm('Changing the cell size clears the cells of every region. Continue?')
    )
      return;
    setCell(d);
    setRegions((rs) => rs.map((r) => (r.kind === 'cells' ? { ...r, cells: [] } : r)));
  }

  function toLonLat(e: MouseEvent<SVGRectElement>): [number, number] | null {
    const svg = e.currentTarget.ownerSVGElement;
    const ctm = svg?.getScreenCTM();
    if (!svg || !ctm || !projRef.current) return null;
    const pt = svg.createSVGPoint();
    pt.x = e.clientX;
    pt.y = e.clientY;
    const p = pt.matrixTransform(ctm.inverse());
    const ll = projRef.current.invert?.([p.x, p.y]);
    return ll && Number.isFinite(ll[0]) && Number.isFinite(ll[1]) ? [ll[0], ll[1]] : null;
  }
  const current = regions[active];
  function applyCells(ids: number[], remove: boolean) {
    if (!current || current.kind !== 'cells') return;
    const set = new Set(current.cells);
    for (const id of ids) {
      if (remove) set.delete(id);
      else set.add(id);
    }
    update(active, { cells: [...set].sort((a, b) => a - b) } as Partial<Region>);
  }
  function onDown(e: MouseEvent<SVGRectElement>) {
    const ll = toLonLat(e);
    if (!ll) return;
    if (tool === 'click') {
      if (!current || current.kind !== 'cells') return;
      const id = cellAt(cell, ll[1], ll[0]);
      applyCells([id], current.cells.includes(id));
    } else setDrag({ a: ll, b: ll });
  }
  function onUp(e: MouseEvent<SVGRectElement>) {
    if (!drag) return;
    const ll = toLonLat(e) ?? drag.b;
    const box = {
      south: Math.min(drag.a[1], ll[1]),
      north: Math.max(drag.a[1], ll[1]),
      west: Math.min(drag.a[0], ll[0]),
      east: Math.max(drag.a[0], ll[0]),
    };
    setDrag(null);
    const ids =
      tool === 'land'
        ? landCellsInBox(makeGlobalGrid(cell), { latMin: box.south, latMax: box.north, lonMin: box.west, lonMax: box.east })
        : cellsInBox(cell, box);
    applyCells(ids, e.altKey);
  }

  async function save() {
    if (problems.length) return;
    setBusy(true);
    setServerError(null);
    try {
      const url = baseId ? `/api/networks/${networkId}/grids/${baseId}` : `/api/networks/${networkId}/grids`;
      const r = await apiSend<{ grid: { id: string } }>('POST', url, { name, notes, cellSizeDeg: cell, regions });
      router.push(`/n/${networkId}/grids/${r.grid.id}`);
    } catch (e) {
      setServerError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  const numberInput = (v: number, on: (n: number) => void, label: string) => (
    <input
      aria-label={label}
      type="number"
      step="any"
      className="w-20 rounded border border-line-strong bg-surface px-1.5 py-1"
      value={v}
      onChange={(e) => on(Number(e.target.value))}
    />
  );

  return (
    <div className="space-y-5">
      <div className="grid gap-4 md:grid-cols-3">
        <FormField id="grid-name" label="Name">
          <input className={inputClass} value={name} onChange={(e) => setName(e.target.value)} />
        </FormField>
        <FormField id="grid-cell" label="Cell size (degrees)">
          <select className={inputClass} value={cell} onChange={(e) => changeCellSize(Number(e.target.value))}>
            {CELL_SIZES.map((d) => (
              <option key={d} value={d}>
                {d}°
              </option>
            ))}
          </select>
        </FormField>
        <FormField id="grid-notes" label="Notes">
          <input className={inputClass} value={notes} onChange={(e) => setNotes(e.target.value)} />
        </FormField>
      </div>
      <div className="flex flex-wrap items-center gap-3 text-sm" role="radiogroup" aria-label="Selection tool">
        <span className="font-medium">Selecting cells:</span>
        {(
          [
            ['click', 'Click toggles a cell'],
            ['box', 'Drag a box'],
            ['land', 'Drag a box, land cells only'],
          ] as [Tool, string][]
        ).map(([t, label]) => (
          <label key={t} className="flex items-center gap-1">
            <input type="radio" name="tool" checked={tool === t} onChange={() => setTool(t)} />
            {label}
          </label>
        ))}
        <span className="text-muted">(hold Alt while dragging to remove)</span>
      </div>
      <div className="select-none rounded border border-line" data-testid="grid-map">
        <WorldMap
          width={W}
          height={H}
          title="Source grid and regions"
          description="Grid lines at the chosen cell size; region cells in their colours; moving regions as their bounds with the centre marked."
        >
          {(projection) => {
            projRef.current = projection;
            const path = geoPath(projection);
            const lines = geoGraticule()
              .step([cell, cell])
              .extent([
                [-180, -90],
                [180, 90],
              ])();
            return (
              <>
                <path d={path(lines) ?? ''} fill="none" className="stroke-line" strokeWidth={0.3} />
                <RegionShapes
                  projection={projection}
                  regions={regions}
                  cellSizeDeg={cell}
                  cellOpacity={(i) => (i === active ? 0.75 : 0.45)}
                />
                {drag
                  ? (() => {
                      const [a, b] = [drag.a, drag.b];
                      return (
                        <path
                          d={path(lonLatBox(a[0], a[1], b[0], b[1])) ?? ''}
                          fill="none"
                          stroke="currentColor"
                          strokeDasharray="3 3"
                        />
                      );
                    })()
                  : null}
                <rect
                  x={0}
                  y={0}
                  width={W}
                  height={H}
                  fill="transparent"
                  style={{ cursor: 'crosshair' }}
                  data-testid="grid-canvas"
                  onMouseDown={onDown}
                  onMouseMove={(e) => {
                    if (drag) {
                      const ll = toLonLat(e);
                      if (ll) setDrag({ ...drag, b: ll });
                    }
                  }}
                  onMouseUp={onUp}
                />
              </>
            );
          }}
        </WorldMap>
      </div>

      <div className="space-y-2">
        <div className="flex gap-2">
          <Button type="button" tone="secondary" onClick={() => addRegion('cells')}>
            Add a region of cells
          </Button>
          <Button type="button" tone="secondary" onClick={() => addRegion('moving')}>
            Add a moving region
          </Button>
        </div>
        {regions.length === 0 ? (
          <p className="text-sm text-muted">No regions yet. Add one, then select its cells on the map.</p>
        ) : null}
        <ul className="space-y-2">
          {regions.map((r, i) => (
            <li key={i} className={`rounded border p-3 text-sm ${i === active ? 'border-accent' : 'border-line'}`}>
              <div className="flex flex-wrap items-center gap-2">
                <label className="flex items-center gap-1">
                  <input type="radio" name="active-region" checked={i === active} onChange={() => setActive(i)} />
                  Selecting for
                </label>
                <input
                  aria-label={`Region ${i + 1} name`}
                  className="w-48 rounded border border-line-strong bg-surface px-2 py-1"
                  value={r.name}
                  onChange={(e) => update(i, { name: e.target.value })}
                />
                {/* The colour shows in a swatch; the select's words stay in ink (WCAG 1.4.3 contrast). */}
                <span
                  aria-hidden
                  className="inline-block size-4 rounded-sm border border-line-strong"
                  style={{ background: r.colour }}
                />
                <select
                  aria-label={`Region ${i + 1} colour`}
                  className="rounded border border-line-strong bg-surface px-2 py-1"
                  value={r.colour}
                  onChange={(e) => update(i, { colour: e.target.value })}
                >
                  {REGION_COLOURS.map((c) => (
                    <option key={c} value={c} style={{ color: c }}>
                      ■ {c}
                    </option>
                  ))}
                </select>
                <span className="text-muted">
                  {r.kind === 'cells' ? `${r.cells.length} cell${r.cells.length === 1 ? '' : 's'}` : 'moving'}
                </span>
                {r.kind === 'cells' ? (
                  <Button type="button" size="sm" tone="quiet" onClick={() => update(i, { cells: [] } as Partial<Region>)}>
                    Clear cells
                  </Button>
                ) : null}
                <Button
                  type="button"
                  size="sm"
                  tone="quiet"
                  onClick={() => {
                    setRegions(regions.filter((_, k) => k !== i));
                    setActive(0);
                  }}
                >
                  Remove
                </Button>
              </div>
              {r.kind === 'moving' ? (
                <div className="mt-2 flex flex-wrap gap-3 tabular-nums">
                  <span>
                    Centre lat{' '}
                    {numberInput(
                      r.centre.lat,
                      (v) => update(i, { centre: { ...r.centre, lat: v } } as Partial<Region>),
                      `${r.name} centre latitude`,
                    )}{' '}
                    lon{' '}
                    {numberInput(
                      r.centre.lon,
                      (v) => update(i, { centre: { ...r.centre, lon: v } } as Partial<Region>),
                      `${r.name} centre longitude`,
                    )}{' '}
                    °
                  </span>
                  <span>
                    Latitude{' '}
                    {numberInput(
                      r.bounds.lat.min,
                      (v) => update(i, { bounds: { ...r.bounds, lat: { ...r.bounds.lat, min: v } } } as Partial<Region>),
                      `${r.name} south bound`,
                    )}{' '}
                    …{' '}
                    {numberInput(
                      r.bounds.lat.max,
                      (v) => update(i, { bounds: { ...r.bounds, lat: { ...r.bounds.lat, max: v } } } as Partial<Region>),
                      `${r.name} north bound`,
                    )}{' '}
                    °
                  </span>
                  <span>
                    Longitude{' '}
                    {numberInput(
                      r.bounds.lon.min,
                      (v) => update(i, { bounds: { ...r.bounds, lon: { ...r.bounds.lon, min: v } } } as Partial<Region>),
                      `${r.name} west bound`,
                    )}{' '}
                    …{' '}
                    {numberInput(
                      r.bounds.lon.max,
                      (v) => update(i, { bounds: { ...r.bounds, lon: { ...r.bounds.lon, max: v } } } as Partial<Region>),
                      `${r.name} east bound`,
                    )}{' '}
                    °
                  </span>
                  <span>
                    Spread {numberInput(r.spreadDeg, (v) => update(i, { spreadDeg: v } as Partial<Region>), `${r.name} spread`)} °
                  </span>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      </div>
      {problems.length ? (
        <Notice tone="error" title="Before saving">
          <ul className="list-disc pl-5">
            {problems.map((p, i) => (
              <li key={i}>{p.message}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      {serverError ? (
        <Notice tone="error" title="Not saved">
          {serverError}
        </Notice>
      ) : null}
      <Button type="button" onClick={save} busy={busy} disabled={busy || problems.length > 0}>
        {baseId ? 'Save as a new version' : 'Save grid'}
      </Button>
    </div>
  );
}
