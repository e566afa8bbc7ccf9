'use client';
/**
 * Create or edit a station. Calibration per component: a flat gain, or a
 * response table typed as lines "frequency_Hz, amplitude, phase_deg".
 * Server errors come back naming the field; they are shown beside it.
 */
import { useState, type FormEvent } from 'react';
import { useRouter } from 'next/navigation';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { apiSend, ApiError } from '@/src/web/swr';
import { COMPONENTS, type Component } from '@/src/engine/components';

type Cal =
  { kind: 'gain'; gain: number } | { kind: 'response'; points: { frequencyHz: number; amplitude: number; phaseDeg: number }[] };

export interface StationFormValue {
  code: string;
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number | null;
  mainsHz: 50 | 60;
  sampleRateHz: number;
  notes: string;
  status: 'operating' | 'paused' | 'retired';
  interferenceLines: { frequencyHz: number; label: string }[];
  components: { component: Component; calibration: Cal }[];
}

const COMP_LABEL: Record<Component, string> = {
  Ez: 'Ez (vertical electric)',
  Bns: 'Bns (north–south coil)',
  Bew: 'Bew (east–west coil)',
};

function calText(c: Cal | undefined): { kind: 'gain' | 'response'; gain: string; table: string } {
  if (!c) return { kind: 'gain', gain: '1', table: '' };
  if (c.kind === 'gain') return { kind: 'gain', gain: String(c.gain), table: '' };
  return {
    kind: 'response',
    gain: '1',
    table: c.points.map((p) => `${p.frequencyHz}, ${p.amplitude}, ${p.phaseDeg}`).join('\n'),
  };
}

export function StationForm({
  networkId,
  initial,
  stationId,
}: {
  networkId: string;
  initial?: StationFormValue;
  stationId?: string;
}) {
  const router = useRouter();
  const [f, setF] = useState({
    code: initial?.code ?? '',
    name: initial?.name ?? '',
    latitude: String(initial?.latitude ?? ''),
    longitude: String(initial?.longitude ?? ''),
    elevationM: initial?.elevationM == null ? '' : String(initial.elevationM),
    mainsHz: String(initial?.mainsHz ?? 50),
    sampleRateHz: String(initial?.sampleRateHz ?? 200),
    notes: initial?.notes ?? '',
    status: initial?.status ?? 'operating',
    lines: (initial?.interferenceLines ?? []).map((l) => `${l.frequencyHz} ${l.label}`).join('\n'),
  });
  const [comps, setComps] = useState(
    () =>
      Object.fromEntries(
        COMPONENTS.map((c) => {
          const have = initial?.components.find((x) => x.component === c);
          return [c, { on: initial ? !!have : true, ...calText(have?.calibration) }];
        }),
      ) as Record<Component, { on: boolean; kind: 'gain' | 'response'; gain: string; table: string }>,
  );
  const [error, setError] = useState<{ message: string; field?: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: keyof typeof f) => (e: { target: { value: string } }) => setF({ ...f, [k]: e.target.value });
  const err = (field: string) => (error?.field === field || error?.field?.startsWith(`${field}.`) ? error.message : null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setError(null);
    const num = (s: string) => (s.trim() === '' ? NaN : Number(s));
    const lines = f.lines
      .split('\n')
      .map((l) => l.trim())
      .filter(Boolean)
      .map((l) => {
        const m = /^([0-9.]+)\s*(?:Hz)?\s*(.*)$/i.exec(l);
        return { frequencyHz: m ? Number(m[1]) : NaN, label: m?.[2]?.trim() || 'interference line' };
      });
    const components = (Object.entries(comps) as [Component, (typeof comps)[Component]][])
      .filter(([, v]) => v.on)
      .map(([component, v]) => ({
        component,
        calibration:
          v.kind === 'gain'
            ? { kind: 'gain' as const, gain: num(v.gain) }
            : {
                kind: 'response' as const,
                points: v.table
                  .split('\n')
                  .map((l) => l.trim())
                  .filter(Boolean)
                  .map((l) => {
                    const [a, b, c] = l.split(/[,;\s]+/).map(Number);
                    return { frequencyHz: a, amplitude: b, phaseDeg: c ?? 0 };
                  }),
              },
      }));
    const body = {
      code: f.code.trim().toUpperCase(),
      name: f.name,
      latitude: num(f.latitude),
      longitude: num(f.longitude),
      elevationM: f.elevationM.trim() === '' ? null : num(f.elevationM),
      mainsHz: Number(f.mainsHz),
      sampleRateHz: num(f.sampleRateHz),
      notes: f.notes,
      status: f.status,
      interferenceLines: lines,
      components,
    };
    setBusy(true);
    try {
      const url = stationId ? `/api/networks/${networkId}/stations/${stationId}` : `/api/networks/${networkId}/stations`;
      const out = await apiSend<{ station: { id: string } }>(stationId ? 'PUT' : 'POST', url, body);
      router.push(`/n/${networkId}/stations/${out.station.id}`);
      router.refresh();
    } catch (x) {
      setError(x instanceof ApiError ? { message: x.message, field: x.field } : { message: String(x) });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      {error && !error.field ? (
        <Notice tone="error" title="Not saved">
          {error.message}
        </Notice>
      ) : null}
      {error?.field ? (
        <Notice tone="error" title="Not saved">
          Check the field marked below: {error.message}
        </Notice>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField id="st-code" label="Code" hint="2–12 capitals or digits, unique in this network" error={err('code')}>
          <input className={inputClass} value={f.code} onChange={set('code')} required />
        </FormField>
        <FormField id="st-name" label="Name" error={err('name')}>
          <input className={inputClass} value={f.name} onChange={set('name')} required />
        </FormField>
        <FormField id="st-lat" label="Latitude (°, north positive)" error={err('latitude')}>
          <input className={inputClass} inputMode="decimal" value={f.latitude} onChange={set('latitude')} />
        </FormField>
        <FormField id="st-lon" label="Longitude (°, east positive)" error={err('longitude')}>
          <input className={inputClass} inputMode="decimal" value={f.longitude} onChange={set('longitude')} />
        </FormField>
        <FormField id="st-elev" label="Elevation (m)" hint="optional" error={err('elevationM')}>
          <input className={inputClass} inputMode="decimal" value={f.elevationM} onChange={set('elevationM')} />
        </FormField>
        <FormField id="st-rate" label="Sampling rate (Hz)" error={err('sampleRateHz')}>
          <input className={inputClass} inputMode="decimal" value={f.sampleRateHz} onChange={set('sampleRateHz')} />
        </FormField>
        <FormField id="st-mains" label="Mains frequency" error={err('mainsHz')}>
          <select className={inputClass} value={f.mainsHz} onChange={set('mainsHz')}>
            <option value="50">50 Hz</option>
            <option value="60">60 Hz</option>
          </select>
        </FormField>
        <FormField id="st-status" label="Status" error={err('status')}>
          <select className={inputClass} value={f.status} onChange={set('status')}>
            <option value="operating">Operating</option>
            <option value="paused">Paused</option>
            <option value="retired">Retired</option>
          </select>
        </FormField>
      </div>
      <FormField
        id="st-lines"
        label="Other interference lines"
        hint='One per line: frequency in Hz, then a label, e.g. "16.7 railway supply"'
        error={err('interferenceLines')}
      >
        <textarea className={inputClass} rows={3} value={f.lines} onChange={set('lines')} />
      </FormField>
      <fieldset className="space-y-3 rounded-[var(--radius-card)] border border-line p-3">
        <legend className="px-1 text-sm font-semibold">Installed components and calibration</legend>
        {err('components') ? <p className="text-xs font-medium text-danger">{err('components')}</p> : null}
        {COMPONENTS.map((c) => {
          const v = comps[c];
          const upd = (p: Partial<typeof v>) => setComps({ ...comps, [c]: { ...v, ...p } });
          return (
            <div key={c} className="space-y-2">
              <label className="flex items-center gap-2 text-sm font-medium">
                <input type="checkbox" checked={v.on} onChange={(e) => upd({ on: e.target.checked })} /> {COMP_LABEL[c]}
              </label>
              {v.on ? (
                <div className="grid gap-3 pl-6 sm:grid-cols-[12rem_1fr]">
                  <FormField id={`cal-kind-${c}`} label="Calibration">
                    <select
                      className={inputClass}
                      value={v.kind}
                      onChange={(e) => upd({ kind: e.target.value as 'gain' | 'response' })}
                    >
                      <option value="gain">Flat gain</option>
                      <option value="response">Response table</option>
                    </select>
                  </FormField>
                  {v.kind === 'gain' ? (
                    <FormField id={`cal-gain-${c}`} label={`Gain (recorded units per ${c === 'Ez' ? 'V/m' : 'T'})`}>
                      <input
                        className={inputClass}
                        inputMode="decimal"
                        value={v.gain}
                        onChange={(e) => upd({ gain: e.target.value })}
                      />
                    </FormField>
                  ) : (
                    <FormField
                      id={`cal-table-${c}`}
                      label="Response table"
                      hint="One row per line: frequency (Hz), amplitude, phase (°)"
                    >
                      <textarea
                        className={`${inputClass} font-mono`}
                        rows={4}
                        value={v.table}
                        onChange={(e) => upd({ table: e.target.value })}
                      />
                    </FormField>
                  )}
                </div>
              ) : null}
            </div>
          );
        })}
      </fieldset>
      <FormField id="st-notes" label="Notes" error={err('notes')}>
        <textarea className={inputClass} rows={3} value={f.notes} onChange={set('notes')} />
      </FormField>
      <Button type="submit" busy={busy}>
        {stationId ? 'Save station' : 'Add station'}
      </Button>
    </form>
  );
}
