import { useState } from 'react';
import { currentTheme, setTheme, type Theme } from '../lib/theme';

export function ThemeToggle() {
  const [theme, set] = useState<Theme>(currentTheme);
  const next: Theme = theme === 'dark' ? 'light' : 'dark';
  return (
    <button
      type="button"
      className="rounded border border-rule px-2 py-1 text-sm text-ink-muted hover:text-ink"
      onClick={() => { setTheme(next); set(next); }}
      aria-label={`Switch to ${next} theme`}
    >
      {theme === 'dark' ? 'Light' : 'Dark'}
    </button>
  );
}
