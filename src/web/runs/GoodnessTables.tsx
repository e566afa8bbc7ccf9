/**
 * Goodness of fit in the open: for the whole run, per station and component,
 * for the selected interval's stations and components, and per interval —
 * chi-square, degrees of freedom, chi2/dof and the probability of a value at
 * least that large under the stated errors. Fits below the run's threshold
 * are marked "implausible" (src/runs/goodness.ts).
 */
import type { ReactNode } from 'react';
import type { Goodness, RunGoodness, SeriesGoodness } from '@/src/runs/goodness';
import { formatValue } from '@/src/web/ui/format';

/** Degrees of freedom: whole for a run, fractional for a series' share of the parameters. */
const dofText = (dof: number) => formatValue(dof, '', { decimals: Number.isInteger(dof) ? 0 : 1 });

function Flag({ g }: { g: Goodness }) {
  return g.implausible ? (
    <span className="ml-1 rounded bg-danger-soft px-1 text-xs font-semibold text-danger" data-testid="fit-implausible">
      implausible
    </span>
  ) : null;
}

function Cells({ g }: { g: Goodness }) {
  return (
    <>
      <td className="px-2 py-1 text-right">{formatValue(g.chi2, '', 5)}</td>
      <td className="px-2 py-1 text-right">{dofText(g.dof)}</td>
      <td className="px-2 py-1 text-right">{formatValue(g.dof > 0 ? g.chi2 / g.dof : NaN)}</td>
      <td className="px-2 py-1 text-right">
        {formatValue(g.p, '', 2)}
        <Flag g={g} />
      </td>
    </>
  );
}

function Table({ caption, first, children }: { caption: string; first: string[]; children: ReactNode }) {
  return (
    // A scrolling box takes the focus, so it scrolls by keyboard too (WCAG 2.1.1).
    <div className="max-h-80 overflow-auto" tabIndex={0} role="region" aria-label={caption}>
      <table className="w-full text-sm tabular-nums">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 border-b border-line bg-surface text-muted">
          <tr>
            {first.map((h) => (
              <th key={h} scope="col" className="px-2 py-1.5 text-left font-medium">
                {h}
              </th>
            ))}
            <th scope="col" className="px-2 py-1.5 text-right font-medium">
              χ²
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-medium">
              dof
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-medium">
              χ²/dof
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-medium">
              P(≥ χ²)
            </th>
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

function SeriesRows({ rows, withCount }: { rows: SeriesGoodness[]; withCount: boolean }) {
  return rows.map((s) => (
    <tr key={`${s.station} ${s.component}`} className={`border-b border-line/60 ${s.implausible ? 'bg-danger-soft/40' : ''}`}>
      <td className="px-2 py-1">{s.station}</td>
      <td className="px-2 py-1">{s.component}</td>
      {withCount ? <td className="px-2 py-1">{s.intervals}</td> : null}
      <Cells g={s} />
    </tr>
  ));
}

/** Goodness of one minimum per station and component: χ², dof, χ²/dof and P(≥ χ²), implausible fits marked. */
export function SeriesGoodnessTable({ rows, caption }: { rows: SeriesGoodness[]; caption: string }) {
  return (
    <Table caption={caption} first={['Station', 'Component']}>
      <SeriesRows rows={rows} withCount={false} />
    </Table>
  );
}

export function GoodnessTables({
  goodness,
  selected,
  selectedStartsAt,
}: {
  goodness: RunGoodness;
  /** Per station and component of the selected interval's best minimum (empty when not recorded). */
  selected: SeriesGoodness[];
  selectedStartsAt: string | null;
}) {
  const { run, intervals, series, threshold, seriesMissing } = goodness;
  const bad = intervals.filter((i) => i.implausible).length;
  const when = (iso: string) => iso.slice(0, 16).replace('T', ' ');
  return (
    <div className="space-y-4" data-testid="goodness">
      <p className="text-sm">
        {run ? (
          <>
            Whole run: χ² = <span data-testid="goodness-run-chi2">{formatValue(run.chi2, '', 5)}</span> for {dofText(run.dof)}{' '}
            degrees of freedom (χ²/dof {formatValue(run.chi2 / run.dof)}), P(≥ χ²) ={' '}
            <span data-testid="goodness-run-p">{formatValue(run.p, '', 2)}</span>
            <Flag g={run} />. {bad} of {intervals.length} intervals implausible.
          </>
        ) : (
          'No solved interval yet.'
        )}
      </p>
      <p className="text-xs text-muted">
        P(≥ χ²) is the probability of a misfit at least this large if the stated errors were right (upper tail of the chi-square
        distribution). Below {threshold} a fit is marked implausible: its errors or the model do not describe those data, and its
        stated uncertainties should not be taken at face value. A station or component carries its share of the fitted parameters
        in its degrees of freedom.
      </p>
      {selectedStartsAt ? (
        <div>
          <h4 className="mb-1 text-sm font-semibold">Selected interval ({when(selectedStartsAt)} UT), best minimum</h4>
          {selected.length ? (
            <SeriesGoodnessTable rows={selected} caption="Goodness of fit of the selected interval per station and component" />
          ) : (
            <p className="text-sm text-muted">Not recorded for this interval (solved before per-series misfits were kept).</p>
          )}
        </div>
      ) : null}
      {series.length ? (
        <div>
          <h4 className="mb-1 text-sm font-semibold">Per station and component, whole run</h4>
          <Table
            caption="Goodness of fit of the whole run per station and component"
            first={['Station', 'Component', 'Intervals']}
          >
            <SeriesRows rows={series} withCount />
          </Table>
          {seriesMissing ? (
            <p className="mt-1 text-xs text-muted">
              {seriesMissing} interval(s) solved before per-series misfits were kept are not in this table.
            </p>
          ) : null}
        </div>
      ) : null}
      {intervals.length > 1 ? (
        <div>
          <h4 className="mb-1 text-sm font-semibold">Per interval (best minimum)</h4>
          <Table caption="Goodness of fit of each interval's best minimum" first={['Interval (UT)']}>
            {intervals.map((i) => (
              <tr
                key={i.startsAt}
                className={`border-b border-line/60 ${i.implausible ? 'bg-danger-soft/40' : ''}`}
                data-testid={i.implausible ? 'interval-implausible' : undefined}
              >
                <td className="px-2 py-1">{when(i.startsAt)}</td>
                <Cells g={i} />
              </tr>
            ))}
          </Table>
        </div>
      ) : null}
    </div>
  );
}
