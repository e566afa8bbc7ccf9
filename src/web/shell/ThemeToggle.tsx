'use client';
/** Light / dark / system colour theme, remembered in this browser. */
import { useEffect, useState } from 'react';

type Choice = 'system' | 'light' | 'dark';
import { THEME_KEY as KEY } from './theme-script';

export function ThemeToggle() {
  const [choice, setChoice] = useState<Choice>('system');
  useEffect(() => {
    const t = localStorage.getItem(KEY);
    if (t === 'light' || t === 'dark') setChoice(t);
  }, []);
  function apply(next: Choice) {
    setChoice(next);
    if (next === 'system') {
      localStorage.removeItem(KEY);
      delete document.documentElement.dataset.theme;
    } else {
      localStorage.setItem(KEY, next);
      document.documentElement.dataset.theme = next;
    }
  }
  return (
    <fieldset className="px-2.5 py-1.5">
      <legend className="mb-1 text-xs text-muted">Colour theme</legend>
      <div className="flex gap-1">
        {(['system', 'light', 'dark'] as const).map((c) => (
          <label key={c} className="cursor-pointer">
            <input
              type="radio"
              name="cavitas-theme"
              value={c}
              checked={choice === c}
              onChange={() => apply(c)}
              className="peer sr-only"
            />
            <span className="block rounded-md border border-line px-2 py-1 text-xs capitalize peer-checked:border-accent peer-checked:bg-accent-soft peer-focus-visible:outline-2 peer-focus-visible:outline-focus">
              {c}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
