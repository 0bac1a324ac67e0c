/** Light / dark theme, remembered per device; charts subscribe so they redraw in the new colours. */
import { useSyncExternalStore } from 'react';

export type Theme = 'light' | 'dark';
const KEY = 'saltation.theme';
const EVENT = 'saltation-theme';

export function storedTheme(): Theme {
  const saved = localStorage.getItem(KEY);
  if (saved === 'light' || saved === 'dark') return saved;
  return window.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
}

export function applyTheme(theme: Theme): void {
  document.documentElement.classList.toggle('dark', theme === 'dark');
  localStorage.setItem(KEY, theme);
  window.dispatchEvent(new Event(EVENT));
}

export function applyStoredTheme(): void {
  document.documentElement.classList.toggle('dark', storedTheme() === 'dark');
}

function subscribe(callback: () => void): () => void {
  window.addEventListener(EVENT, callback);
  return () => window.removeEventListener(EVENT, callback);
}

const current = (): Theme =>
  document.documentElement.classList.contains('dark') ? 'dark' : 'light';

/** The theme in force; components re-render when it changes. */
export function useTheme(): Theme {
  return useSyncExternalStore(subscribe, current, () => 'light');
}
