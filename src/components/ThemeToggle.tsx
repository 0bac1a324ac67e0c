import { useState } from 'react';
import { applyTheme, storedTheme, type Theme } from './theme';

export function ThemeToggle() {
  const [theme, setTheme] = useState<Theme>(storedTheme);
  const next = theme === 'dark' ? 'light' : 'dark';
  return (
    <button
      type="button"
      className="rounded-md border border-rule px-2 py-1 text-sm text-muted hover:text-ink"
      aria-label={`Switch to ${next} theme`}
      onClick={() => {
        applyTheme(next);
        setTheme(next);
      }}
    >
      {theme === 'dark' ? 'Light' : 'Dark'}
    </button>
  );
}
