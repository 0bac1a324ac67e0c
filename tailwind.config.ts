import type { Config } from 'tailwindcss';

// Saltation's own palette: warm paper, ink, teal primary; slate blue for base curves and coral
// for stressed ones. The dark theme swaps the CSS variables (see src/styles.css).
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  darkMode: 'class',
  theme: {
    extend: {
      colors: {
        paper: 'rgb(var(--paper) / <alpha-value>)',
        panel: 'rgb(var(--panel) / <alpha-value>)',
        ink: 'rgb(var(--ink) / <alpha-value>)',
        muted: 'rgb(var(--muted) / <alpha-value>)',
        rule: 'rgb(var(--rule) / <alpha-value>)',
        teal: 'rgb(var(--teal) / <alpha-value>)',
        'base-curve': 'rgb(var(--base) / <alpha-value>)',
        stressed: 'rgb(var(--stressed) / <alpha-value>)',
        warn: 'rgb(var(--warn) / <alpha-value>)',
      },
      fontFamily: {
        sans: ['"Source Sans 3"', 'system-ui', 'sans-serif'],
      },
    },
  },
  plugins: [],
} satisfies Config;
