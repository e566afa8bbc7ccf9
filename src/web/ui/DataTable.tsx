'use client';
/**
 * Sortable data table on @tanstack/react-table (v9). Columns are plain,
 * serialisable descriptions so server components can pass them:
 *   <DataTable caption="Stations" rows={rows}
 *     columns={[{ key: 'name', header: 'Station', hrefKey: 'url' },
 *               { key: 'f1', header: 'f₁', unit: 'Hz', numeric: true, digits: 2 }]} />
 * Numbers are right-aligned with tabular figures; units sit in the header.
 */
import { useMemo, type ReactNode } from 'react';
import Link from 'next/link';
import {
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
} from '@tanstack/react-table';
import { formatUtc, formatValue } from './format';
import { saveCsv } from './export';
import { cx } from './cx';

export type Row = Record<string, unknown>;

export interface DataColumn {
  /** Property of the row to show. */
  key: string;
  header: string;
  /** Unit shown in the header, e.g. "Hz" or "(mV/m)^2/Hz". */
  unit?: string;
  /** Right-aligned, tabular, by the one number formatter (`formatValue`). */
  numeric?: boolean;
  /** Decimal places in the header's unit (default 2), so the column lines up. */
  digits?: number;
  /** Values are dates/ISO strings: shown in UTC. */
  time?: boolean;
  /** Property holding a URL: the cell becomes a link. */
  hrefKey?: string;
  /** Defaults to true. */
  sortable?: boolean;
  /** Client-side only: a custom cell renderer (cannot be passed from a server component). */
  render?: (row: Row) => ReactNode;
}

interface DataTableProps {
  caption: string;
  /** Hide the caption visually (still read by screen readers). */
  captionHidden?: boolean;
  columns: DataColumn[];
  rows: Row[];
  /** Property with a stable row id (defaults to "id", then the index). */
  rowKey?: string;
  /** Offer the rows as a CSV file (default true). */
  csv?: boolean;
  /** Shown instead of the table when there are no rows. */
  empty?: ReactNode;
  initialSort?: { key: string; desc?: boolean };
  className?: string;
}

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, datetime: sortFn_datetime, basic: sortFn_basic },
});

function display(col: DataColumn, v: unknown): ReactNode {
  if (col.time) return formatUtc(v as string | Date | null);
  if (col.numeric) return typeof v === 'number' ? formatValue(v, '', { decimals: col.digits ?? 2 }) : v == null ? '—' : String(v);
  if (v == null || v === '') return '—';
  return String(v);
}

export function DataTable({
  caption,
  captionHidden,
  columns,
  rows,
  rowKey = 'id',
  empty,
  initialSort,
  className,
  csv = true,
}: DataTableProps) {
  const defs = useMemo(
    () =>
      columns.map((c) => ({
        id: c.key,
        accessorFn: (r: Row) => {
          const v = r[c.key];
          if (c.time && v != null) return new Date(v as string).getTime();
          return v as never;
        },
        header: c.header,
        enableSorting: c.sortable !== false,
        sortUndefined: 'last' as const,
        sortFn: (c.numeric || c.time ? 'basic' : 'alphanumeric') as 'basic' | 'alphanumeric',
      })),
    [columns],
  );
  const table = useTable({
    features,
    columns: defs as never,
    data: rows,
    getRowId: (r: Row, i: number) => String(r[rowKey] ?? i),
    initialState: initialSort ? { sorting: [{ id: initialSort.key, desc: !!initialSort.desc }] } : undefined,
  } as never);

  if (rows.length === 0 && empty) return <>{empty}</>;
  const byId = new Map(columns.map((c) => [c.key, c]));

  return (
    <div className={cx('relative overflow-x-auto rounded-[var(--radius-card)] border border-line bg-surface', className)}>
      {csv && rows.length ? (
        <button
          type="button"
          className="absolute top-2 right-2 rounded px-1.5 py-0.5 text-xs text-muted hover:bg-raised hover:text-fg"
          aria-label={`Download “${caption}” as CSV`}
          onClick={() =>
            saveCsv(
              caption,
              columns.filter((c) => c.header),
              table.getRowModel().rows.map((r) => r.original as Row),
            )
          }
        >
          CSV
        </button>
      ) : null}
      <table className="w-full border-collapse text-sm">
        <caption className={captionHidden ? 'sr-only' : 'px-3 pt-3 pb-1 text-left text-sm font-semibold'}>{caption}</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b border-line-strong">
              {group.headers.map((header) => {
                const col = byId.get(header.column.id)!;
                const sorted = header.column.getIsSorted();
                const label = (
                  <>
                    {col.header}
                    {col.unit ? <span className="ml-1 font-normal text-muted">({col.unit})</span> : null}
                  </>
                );
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className={cx('px-3 py-2 font-semibold whitespace-nowrap', col.numeric ? 'text-right' : 'text-left')}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={cx('inline-flex items-center gap-1 hover:text-accent', col.numeric && 'flex-row-reverse')}
                      >
                        <span>{label}</span>
                        <span aria-hidden className={cx('text-xs', sorted ? 'text-accent' : 'text-muted/50')}>
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-line last:border-b-0 hover:bg-raised/60">
              {columns.map((col) => {
                const r = row.original as Row;
                const content = col.render ? col.render(r) : display(col, r[col.key]);
                const href = col.hrefKey ? (r[col.hrefKey] as string | undefined) : undefined;
                return (
                  <td key={col.key} className={cx('px-3 py-2 align-baseline', col.numeric && 'num text-right font-mono')}>
                    {href ? (
                      <Link href={href} className="font-medium text-accent underline-offset-2 hover:underline">
                        {content}
                      </Link>
                    ) : (
                      content
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
