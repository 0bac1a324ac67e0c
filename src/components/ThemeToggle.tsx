import { applyTheme, useTheme } from './theme';

export function ThemeToggle() {
  const theme = useTheme();
  const next = theme === 'dark' ? 'light' : 'dark';
  return (
    <button
      type="button"
      className="rounded-md border border-rule px-2 py-1 text-sm text-muted hover:text-ink"
      aria-label={`Switch to ${next} theme`}
      onClick={() => applyTheme(next)}
    >
      {theme === 'dark' ? 'Light' : 'Dark'}
    </button>
  );
}
