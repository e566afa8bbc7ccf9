'use client';
/**
 * Describe a cavity model: linear, Ishaq–Jones, or a table typed or uploaded
 * as lines "f, c/V, attenuation dB/Mm" (or "f, Re nu, Im nu"). The engine's
 * schema checks it here and again on the server; each problem names its row.
 * Saving an existing model adds a new version.
 */
import { useMemo, useState, type FormEvent } from 'react';
import { useRouter } from 'next/navigation';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { apiSend } from '@/src/web/swr';
import { modelInputSchema, parseTableText } from '@/src/runs/model-spec';
import type { CavityConfig } from '@/src/engine/cavity/types';
import { ModelCurves } from './ModelCurves';

export interface ModelEditorValue {
  name: string;
  notes: string;
  config: CavityConfig;
}

export function ModelEditor({ networkId, initial, baseId }: { networkId: string; initial?: ModelEditorValue; baseId?: string }) {
  const router = useRouter();
  const [name, setName] = useState(initial?.name ?? '');
  const [notes, setNotes] = useState(initial?.notes ?? '');
  const [model, setModel] = useState<CavityConfig['model']>(initial?.config.model ?? 'ishaq-jones');
  const [radius, setRadius] = useState(String(initial?.config.earthRadiusKm ?? 6371));
  const [height, setHeight] = useState(String(initial?.config.heightKm ?? 60));
  const [columns, setColumns] = useState<'speed-attenuation' | 'nu'>(initial?.config.table?.columns ?? 'speed-attenuation');
  const [tableText, setTableText] = useState(initial?.config.table?.rows.map((r) => r.join(', ')).join('\n') ?? '');
  const [serverError, setServerError] = useState<{ message: string; field?: string } | null>(null);
  const [busy, setBusy] = useState(false);

  const parsed = useMemo(() => {
    const table = model === 'table' ? parseTableText(tableText) : null;
    const candidate = {
      name,
      notes,
      config: {
        model,
        earthRadiusKm: Number(radius),
        heightKm: Number(height),
        ...(table ? { table: { columns, rows: table.rows } } : {}),
      },
    };
    const r = modelInputSchema.safeParse(candidate);
    const problems = [
      ...(table?.error ? [{ field: 'config.table', message: table.error }] : []),
      ...(r.success ? [] : r.error.issues.map((i) => ({ field: i.path.join('.'), message: i.message }))),
    ];
    return { value: r.success ? r.data : null, problems };
  }, [name, notes, model, radius, height, columns, tableText]);
  const err = (f: string) =>
    parsed.problems.find((p) => p.field === f || p.field.startsWith(`${f}.`))?.message ??
    (serverError?.field?.startsWith(f) ? serverError.message : null);

  async function save(e: FormEvent) {
    e.preventDefault();
    if (!parsed.value || parsed.problems.length) return;
    setBusy(true);
    setServerError(null);
    try {
      const url = baseId ? `/api/networks/${networkId}/models/${baseId}` : `/api/networks/${networkId}/models`;
      const r = await apiSend<{ model: { id: string } }>('POST', url, parsed.value);
      router.push(`/n/${networkId}/models/${r.model.id}`);
    } catch (x) {
      const ex = x as Error & { field?: string };
      setServerError({ message: ex.message, field: ex.field });
    } finally {
      setBusy(false);
    }
  }

  async function upload(file: File | undefined) {
    if (file) setTableText(await file.text());
  }

  return (
    <form onSubmit={save} className="space-y-5" noValidate>
      <div className="grid gap-4 md:grid-cols-2">
        <FormField id="model-name" label="Name" error={err('name')}>
          <input className={inputClass} value={name} onChange={(e) => setName(e.target.value)} />
        </FormField>
        <FormField id="model-kind" label="Propagation parameter from">
          <select className={inputClass} value={model} onChange={(e) => setModel(e.target.value as CavityConfig['model'])}>
            <option value="ishaq-jones">Ishaq–Jones (1977) velocity and attenuation</option>
            <option value="linear">Linear ν(f) = (f − 2)/6 − i f/70</option>
            <option value="table">A table of my own</option>
          </select>
        </FormField>
        <FormField id="model-radius" label="Earth radius (km)" error={err('config.earthRadiusKm')}>
          <input type="number" step="any" className={inputClass} value={radius} onChange={(e) => setRadius(e.target.value)} />
        </FormField>
        <FormField id="model-height" label="Effective height (km)" error={err('config.heightKm')}>
          <input type="number" step="any" className={inputClass} value={height} onChange={(e) => setHeight(e.target.value)} />
        </FormField>
      </div>
      {model === 'table' ? (
        <div className="space-y-2">
          <FormField id="model-columns" label="Table columns">
            <select className={inputClass} value={columns} onChange={(e) => setColumns(e.target.value as typeof columns)}>
              <option value="speed-attenuation">f (Hz), c/V, attenuation (dB/Mm)</option>
              <option value="nu">f (Hz), Re ν, Im ν</option>
            </select>
          </FormField>
          <FormField
            id="model-table"
            label="Rows, one per line, frequencies increasing"
            hint="Comma, semicolon, tab or space separated; lines starting with # are ignored."
            error={err('config.table')}
          >
            <textarea
              rows={8}
              className={`${inputClass} font-mono`}
              value={tableText}
              onChange={(e) => setTableText(e.target.value)}
            />
          </FormField>
          <label className="text-sm">
            Or read a file <input type="file" accept=".csv,.txt,.tsv" onChange={(e) => void upload(e.target.files?.[0])} />
          </label>
        </div>
      ) : null}
      <FormField id="model-notes" label="Notes" hint="Where the values come from, what changed in this version.">
        <textarea rows={2} className={inputClass} value={notes} onChange={(e) => setNotes(e.target.value)} />
      </FormField>
      {serverError && !serverError.field ? (
        <Notice tone="error" title="Not saved">
          {serverError.message}
        </Notice>
      ) : null}
      <Button type="submit" busy={busy} disabled={busy || !!parsed.problems.length}>
        {baseId ? 'Save as a new version' : 'Save model'}
      </Button>
      {parsed.value ? <ModelCurves config={parsed.value.config} /> : null}
    </form>
  );
}
