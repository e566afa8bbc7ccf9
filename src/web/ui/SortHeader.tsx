/**
 * Sortable table columns: the sort state (clicking the sorted column reverses
 * it, another column sorts ascending) and the heading cell that changes it and
 * announces the order to screen readers.
 */
import { useState, type ReactNode } from 'react';

export interface SortState<K> {
  key: K;
  desc: boolean;
}

export function useSort<K>(initial: SortState<K>): [SortState<K>, (key: K) => void] {
  const [sort, setSort] = useState(initial);
  return [sort, (key: K) => setSort((s) => ({ key, desc: s.key === key ? !s.desc : false }))];
}

export function SortHeader<K>({
  column,
  sort,
  onSort,
  align = 'right',
  children,
}: {
  column: K;
  sort: SortState<K>;
  onSort: (key: K) => void;
  align?: 'left' | 'right';
  children: ReactNode;
}) {
  const on = sort.key === column;
  return (
    <th
      scope="col"
      className={`px-2 py-1.5 font-medium ${align === 'left' ? 'text-left' : 'text-right'}`}
      aria-sort={on ? (sort.desc ? 'descending' : 'ascending') : 'none'}
    >
      <button type="button" className="hover:text-accent" onClick={() => onSort(column)}>
        {children}
        {on ? (sort.desc ? ' ▾' : ' ▴') : ''}
      </button>
    </th>
  );
}
