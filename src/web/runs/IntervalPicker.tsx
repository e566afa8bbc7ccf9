/**
 * Choosing one solved interval of a run by its UT start: the options alone
 * (for a page's GET form) or a labelled select that reports the choice.
 * No hooks: renders on the server or inside a client view alike.
 */

/** The solved intervals as select options, labelled by their UT start (YYYY-MM-DD HH:MM). */
export function IntervalOptions({ intervals }: { intervals: { startsAt: string }[] }) {
  return intervals.map((i) => (
    <option key={i.startsAt} value={i.startsAt}>
      {i.startsAt.slice(0, 16).replace('T', ' ')}
    </option>
  ));
}

/** A labelled select over the solved intervals; nothing when there is only one to show. */
export function IntervalPicker({
  intervals,
  value,
  onChange,
}: {
  intervals: { startsAt: string }[];
  value: string;
  onChange: (startsAt: string) => void;
}) {
  if (intervals.length < 2) return null;
  return (
    <label className="mb-3 block text-sm">
      Interval (UT){' '}
      <select
        className="ml-2 rounded border border-line-strong bg-surface px-2 py-1"
        value={value}
        onChange={(e) => onChange(e.target.value)}
      >
        <IntervalOptions intervals={intervals} />
      </select>
    </label>
  );
}
