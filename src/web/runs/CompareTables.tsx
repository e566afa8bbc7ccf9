/**
 * The compare page's tables (server-drawn): settings of the two picks with the
 * rows that differ marked, and the two minima's parameters with their
 * difference and whether they agree within the combined one-sigma error.
 */
import type { ParameterRow, SettingRow } from '@/src/runs/compare';
import type { ReactNode } from 'react';
import { Badge } from '@/src/web/ui/Badge';
import { formatMeasured, formatValue } from '@/src/web/ui/format';

const VERDICT = {
  agree: { tone: 'ok', words: 'agree (≤ 1σ)' },
  'within 2σ': { tone: 'storm', words: 'within 2σ' },
  differ: { tone: 'danger', words: 'differ (> 2σ)' },
  'no error': { tone: 'neutral', words: 'no error stated' },
} as const;

/** A column heading: numeric columns align right; the last one keeps no gap on its right. */
function Col({ children, numeric = false, last = false }: { children: ReactNode; numeric?: boolean; last?: boolean }) {
  const cls = ['py-1', last ? '' : 'pr-3', numeric ? 'text-right' : '', 'font-medium'].filter(Boolean).join(' ');
  return (
    <th scope="col" className={cls}>
      {children}
    </th>
  );
}

export function SettingsDiffTable({ rows, labels }: { rows: SettingRow[]; labels: [string, string] }) {
  return (
    <table className="w-full text-left text-sm" data-testid="settings-diff">
      <thead className="text-muted">
        <tr>
          <Col>Setting</Col>
          <Col>{labels[0]}</Col>
          <Col last>{labels[1]}</Col>
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
          <Col>Parameter</Col>
          <Col numeric>A</Col>
          <Col numeric>B</Col>
          <Col numeric>B − A</Col>
          <Col numeric>|B − A| / σc</Col>
          <Col last>Verdict</Col>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.name} className="border-t border-line">
            <th scope="row" className="py-1 pr-3 text-left font-medium">
              {r.name} {r.name.endsWith('intensity') ? '(C² km²/s)' : '(°)'}
            </th>
            <td className="py-1 pr-3 text-right">{formatMeasured(r.a, r.errorA)}</td>
            <td className="py-1 pr-3 text-right">{formatMeasured(r.b, r.errorB)}</td>
            <td className="py-1 pr-3 text-right">{formatMeasured(r.difference, r.combinedError)}</td>
            <td className="py-1 pr-3 text-right">{formatValue(r.z, '', 2)}</td>
            <td className="py-1">
              {r.agreement ? <Badge tone={VERDICT[r.agreement].tone}>{VERDICT[r.agreement].words}</Badge> : 'only in one'}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
