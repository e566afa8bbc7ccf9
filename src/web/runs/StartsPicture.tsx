'use client';
/** The multi-start picture (`startsFigure`) with its key of marks. */
import { useMemo } from 'react';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { REACHED, STOPPED_SHORT, startsFigure } from './figures/starts';
import type { InversionResult } from './types';

export function StartsPicture({
  result,
  selected,
  prerendered,
}: {
  result: InversionResult;
  selected: number;
  prerendered?: string | null;
}) {
  const own = result.startEnds !== undefined;
  const spec = useMemo(() => startsFigure(result, selected), [result, selected]);
  return (
    <div data-testid="starts-picture" data-own-misfits={own ? 'yes' : 'no'}>
      <PlotFigure {...spec} options={spec.build} prerendered={prerendered} />
      {own ? (
        <ul className="mt-1 flex flex-wrap gap-4 text-xs text-muted" aria-label="Marks">
          <li className="flex items-center gap-1.5">
            <svg width="10" height="10" aria-hidden="true">
              <circle cx="5" cy="5" r="4" fill={REACHED} />
            </svg>{' '}
            converged
          </li>
          <li className="flex items-center gap-1.5">
            <svg width="10" height="10" aria-hidden="true">
              <path d="M5 0.5 L9.5 9 L0.5 9 Z" fill={STOPPED_SHORT} />
            </svg>{' '}
            stopped without converging
          </li>
        </ul>
      ) : null}
    </div>
  );
}
