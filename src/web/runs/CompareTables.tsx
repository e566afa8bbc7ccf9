/**
 * The compare page's tables (server-drawn): settings of the two picks with the
 * rows that differ marked, and the two minima's parameters with their
 * difference and whether they agree within the combined one-sigma error.
 */
import type { ParameterRow, SettingRow } from '@/src/runs/compare';
import { Badge } from '@/src/web/ui/Badge';
import { fmt } from './types';

const VERDICT = {
  agree: { tone: 'ok', words: 'agree (≤ 1σ)' },
  'within 2σ': { tone: 'storm', words: 'within 2σ' },
  differ: { tone: 'danger', words: 'differ (> 2σ)' },
  'no error': { tone: 'neutral', words: 'no error stated' },
} as const;

const withError = (v: number | null, e: number | null) => (v === null ? '—' : e === null ? fmt(v) : `${fmt(v)} ± ${fmt(e, 2)}`);

export function SettingsDiffTable({ rows, labels }: { rows: SettingRow[]; labels: [string, string] }) {
  return (
    <table className="w-full text-left text-sm" data-testid="settings-diff">
      <thead className="text-muted">
        <tr>
          <th scope="col" className="py-1 pr-3 font-medium">
            Setting
          </th>
          <th scope="col" className="py-1 pr-3 font-medium">
            {labels[0]}
          </th>
          <th scope="col" className="py-1 font-medium">
            {labels[1]}
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr
            key={r.label}
            className={r.differs ? 'border-t border-line bg-storm-soft' : 'border-t border-line'}
            data-differs={r.differs}
          >
            <th scope="row" className="py-1 pr-3 font-medium">
              {r.label}
              {r.differs ? <span className="sr-only"> (differs)</span> : null}
            </th>
            <td className="py-1 pr-3">{r.a}</td>
            <td className="py-1">{r.b}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function ParameterTable({ rows }: { rows: ParameterRow[] }) {
  if (rows.length === 0) return <p className="text-sm text-muted">One of the picks has no solved minimum to compare.</p>;
  return (
    <table className="w-full text-sm tabular-nums" data-testid="parameter-table">
      <thead className="text-left text-muted">
        <tr>
          <th scope="col" className="py-1 pr-3 font-medium">
            Parameter
          </th>
          <th scope="col" className="py-1 pr-3 text-right font-medium">
            A
          </th>
          <th scope="col" className="py-1 pr-3 text-right font-medium">
            B
          </th>
          <th scope="col" className="py-1 pr-3 text-right font-medium">
            B − A
          </th>
          <th scope="col" className="py-1 pr-3 text-right font-medium">
            |B − A| / σc
          </th>
          <th scope="col" className="py-1 font-medium">
            Verdict
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.name} className="border-t border-line">
            <th scope="row" className="py-1 pr-3 text-left font-medium">
              {r.name} {r.name.endsWith('intensity') ? '(C² km²/s)' : '(°)'}
            </th>
            <td className="py-1 pr-3 text-right">{withError(r.a, r.errorA)}</td>
            <td className="py-1 pr-3 text-right">{withError(r.b, r.errorB)}</td>
            <td className="py-1 pr-3 text-right">{withError(r.difference, r.combinedError)}</td>
            <td className="py-1 pr-3 text-right">{r.z === null ? '—' : fmt(r.z, 2)}</td>
            <td className="py-1">
              {r.agreement ? <Badge tone={VERDICT[r.agreement].tone}>{VERDICT[r.agreement].words}</Badge> : 'only in one'}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
