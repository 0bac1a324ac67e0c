/** Light / dark theme, remembered per device. */
export type Theme = 'light' | 'dark';
const KEY = 'saltation.theme';

export function storedTheme(): Theme {
  const saved = localStorage.getItem(KEY);
  if (saved === 'light' || saved === 'dark') return saved;
  return window.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
}

export function applyTheme(theme: Theme): void {
  document.documentElement.classList.toggle('dark', theme === 'dark');
  localStorage.setItem(KEY, theme);
}

export function applyStoredTheme(): void {
  document.documentElement.classList.toggle('dark', storedTheme() === 'dark');
}
