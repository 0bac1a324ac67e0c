/** Chart colours from the theme's CSS variables, so Plotly follows light and dark. */
function cssColor(name: string, fallback: string): string {
  if (typeof document === 'undefined') return fallback;
  const v = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return v ? `rgb(${v.split(/\s+/).join(',')})` : fallback;
}

export interface ChartTheme {
  ink: string;
  muted: string;
  grid: string;
  paper: string;
  base: string;
  stressed: string;
  teal: string;
}

/** `theme` is only a cache key: the colours are read from the CSS variables in force. */
export function chartTheme(theme: 'light' | 'dark'): ChartTheme {
  void theme;
  return {
    ink: cssColor('--ink', '#1F2A30'),
    muted: cssColor('--muted', '#5E6A70'),
    grid: cssColor('--rule', '#E7E3DA'),
    paper: cssColor('--paper', '#FBFAF7'),
    base: cssColor('--base', '#3B6EA5'),
    stressed: cssColor('--stressed', '#E4572E'),
    teal: cssColor('--teal', '#0F766E'),
  };
}

export const PLOT_CONFIG = {
  displaylogo: false,
  responsive: true,
  modeBarButtonsToRemove: ['lasso2d', 'select2d'],
} as const;

/** The frame every chart shares: transparent backgrounds and the app's font in ink. */
export function chartFrame(t: ChartTheme, size = 12) {
  return {
    paper_bgcolor: 'rgba(0,0,0,0)',
    plot_bgcolor: 'rgba(0,0,0,0)',
    font: { family: "'Source Sans 3', sans-serif", color: t.ink, size },
  };
}

/**
 * A log axis in the product's style: labelled at decades only, as powers of ten (no digits at
 * the minor ticks, no SI prefixes such as 1μ for a probability).
 */
export const LOG_AXIS = {
  type: 'log',
  dtick: 1,
  exponentformat: 'power',
  showexponent: 'all',
} as const;

/**
 * `LOG_AXIS` labelled every n decades, n the fewest that keeps the labels about 22 px apart on
 * an axis of that many pixels spanning [min, max].
 */
export function logAxisFor(min: number, max: number, pixels: number) {
  const decades = min > 0 && max > min ? Math.log10(max / min) : 1;
  const labels = Math.max(1, Math.floor(pixels / 22));
  return { ...LOG_AXIS, dtick: Math.max(1, Math.ceil(decades / labels)) };
}

/** A theme colour (`rgb(r,g,b)` or `#rrggbb`) at opacity `alpha`, for fills the legend shows. */
export function withAlpha(color: string, alpha: number): string {
  const rgb = color.match(/^rgb\((.*)\)$/);
  if (rgb) return `rgba(${rgb[1]},${alpha})`;
  const hex = color.match(/^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i);
  if (hex)
    return `rgba(${hex
      .slice(1)
      .map((h) => parseInt(h, 16))
      .join(',')},${alpha})`;
  return color;
}

/** A horizontal legend under the plot (or above it), left-aligned, in the app's small type. */
export function legendRow(where: 'above' | 'below' = 'below', offset = 0.2) {
  return {
    orientation: 'h',
    x: 0,
    xanchor: 'left',
    y: where === 'above' ? 1 + offset : -offset,
    yanchor: where === 'above' ? 'bottom' : 'top',
    font: { size: 11 },
  } as const;
}

/** A bold title at the top left of one panel of a grid of small charts. */
export function panelTitle(suffix: string, text: string, y = 1.14) {
  return {
    text: `<b>${text}</b>`,
    xref: `x${suffix} domain`,
    yref: `y${suffix} domain`,
    x: 0,
    y,
    showarrow: false,
    xanchor: 'left',
  };
}
