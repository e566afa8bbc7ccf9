'use client';
/** Light / dark / system colour theme, remembered in this browser. */
import { useSyncExternalStore } from 'react';
import { THEME_KEY as KEY } from './theme-script';

type Choice = 'system' | 'light' | 'dark';

// The stored choice is a small external store: localStorage, with listeners for changes made
// here and in other tabs (the 'storage' event).
const listeners = new Set<() => void>();
function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  window.addEventListener('storage', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', listener);
  };
}
function storedChoice(): Choice {
  const t = localStorage.getItem(KEY);
  return t === 'light' || t === 'dark' ? t : 'system';
}
function applyChoice(next: Choice): void {
  if (next === 'system') {
    localStorage.removeItem(KEY);
    delete document.documentElement.dataset.theme;
  } else {
    localStorage.setItem(KEY, next);
    document.documentElement.dataset.theme = next;
  }
  for (const l of listeners) l();
}

export function ThemeToggle() {
  const choice = useSyncExternalStore<Choice>(subscribe, storedChoice, () => 'system');
  const apply = applyChoice;
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
