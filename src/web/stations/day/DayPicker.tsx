'use client';
/** The day view's choices: UTC day, component and which intervals the table lists. */
import { FormField, inputClass } from '@/src/web/ui';
import type { IntervalFilter } from './types';

function Choice<T extends string>({
  id,
  label,
  value,
  options,
  onChange,
}: {
  id: string;
  label: string;
  value: T;
  options: readonly (T | [T, string])[];
  onChange: (v: T) => void;
}) {
  return (
    <FormField id={id} label={label}>
      <select className={inputClass} value={value} onChange={(e) => onChange(e.target.value as T)}>
        {options.map((o) => {
          const [v, text] = Array.isArray(o) ? o : [o, o];
          return (
            <option key={v} value={v}>
              {text}
            </option>
          );
        })}
      </select>
    </FormField>
  );
}

const FILTERS: [IntervalFilter, string][] = [
  ['all', 'all'],
  ['clean', 'clean only'],
  ['quality', 'with quality flags'],
  ['flagged', 'flagged by a person'],
];

/** What the day view shows: UTC day (YYYY-MM-DD), component and table filter. */
export interface DayChoice {
  day: string;
  component: string;
  show: IntervalFilter;
}

export function DayPicker(p: {
  days: string[];
  components: string[];
  choice: DayChoice;
  onChange: (c: Partial<DayChoice>) => void;
}) {
  const { day, component, show } = p.choice;
  return (
    <div className="flex flex-wrap gap-3">
      <Choice id="dv-day" label="UTC day" value={day} options={p.days} onChange={(d) => p.onChange({ day: d })} />
      <Choice
        id="dv-comp"
        label="Component"
        value={component}
        options={p.components}
        onChange={(c) => p.onChange({ component: c })}
      />
      <Choice
        id="dv-show"
        label="Intervals in the table"
        value={show}
        options={FILTERS}
        onChange={(s) => p.onChange({ show: s })}
      />
    </div>
  );
}
