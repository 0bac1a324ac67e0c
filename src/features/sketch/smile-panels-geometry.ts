/**
 * The geometry of the smile panels drawn on one canvas: where each expiry's panel sits, its
 * axis ranges (the vol axis held while a drag keeps inside it, so the axes do not jump), nice
 * tick values, data-to-pixel mapping and the nearest drawn point to a pointer. Pure: the
 * component draws with it and the tests check it.
 */

export interface Rect {
  left: number;
  top: number;
  width: number;
  height: number;
}

/** One panel: its plotting area (CSS pixels) and its ranges ([left, right] may run backwards). */
export interface PanelGeometry {
  plot: Rect;
  x: [number, number];
  y: [number, number];
}

export const PANEL_HEIGHT = 230;
export const LEGEND_HEIGHT = 28;
const MARGIN = { left: 46, right: 12, top: 24, bottom: 26 };

export function panelGrid(n: number): { columns: number; rows: number } {
  const columns = Math.max(1, Math.min(n, n > 4 ? 3 : n));
  return { columns, rows: Math.ceil(n / columns) };
}

/** The plotting area of panel i of n in a chart `width` wide. */
export function panelRect(i: number, n: number, width: number): Rect {
  const { columns } = panelGrid(n);
  const cell = width / columns;
  const col = i % columns;
  const row = Math.floor(i / columns);
  return {
    left: col * cell + MARGIN.left,
    top: LEGEND_HEIGHT + row * PANEL_HEIGHT + MARGIN.top,
    width: Math.max(10, cell - MARGIN.left - MARGIN.right),
    height: PANEL_HEIGHT - MARGIN.top - MARGIN.bottom,
  };
}

export function extent(values: Iterable<number | null>): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values)
    if (v !== null && Number.isFinite(v)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  return lo <= hi ? [lo, hi] : null;
}

/** A 1, 2 or 5 × 10^k step giving about `count` ticks over [lo, hi]. */
export function niceStep(lo: number, hi: number, count = 4): number {
  const raw = Math.max(Math.abs(hi - lo), 1e-12) / count;
  const k = 10 ** Math.floor(Math.log10(raw));
  const f = raw / k;
  return (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * k;
}

export function ticks(lo: number, hi: number, count = 4): number[] {
  const a = Math.min(lo, hi);
  const b = Math.max(lo, hi);
  const step = niceStep(a, b, count);
  const out: number[] = [];
  // whole multiples of the step, rounded so that 3 × 0.2 reads 0.6
  for (let i = Math.ceil(a / step - 1e-9); i <= Math.floor(b / step + 1e-9); i++)
    out.push(i === 0 ? 0 : Number((i * step).toPrecision(12)));
  return out;
}

/**
 * The vol axis (in vol points): the data's range padded to whole ticks. A held range is kept
 * while the data stays inside it and fills at least half of it, so a drag redraws the lines
 * and not the axes.
 */
export function volRange(
  vols: Iterable<number | null>,
  held: [number, number] | null,
): [number, number] {
  const e = extent(vols);
  if (!e) return held ?? [0, 100];
  const [lo, hi] = e;
  if (held && lo >= held[0] && hi <= held[1] && hi - lo >= 0.5 * (held[1] - held[0])) return held;
  const pad = Math.max(0.5, 0.08 * (hi - lo));
  // bounds on a finer step than the ticks': the range hugs the data
  const step = niceStep(lo - pad, hi + pad, 8);
  return [Math.max(0, Math.floor((lo - pad) / step) * step), Math.ceil((hi + pad) / step) * step];
}

export function toPixel(g: PanelGeometry, x: number, y: number): { px: number; py: number } {
  return {
    px: g.plot.left + ((x - g.x[0]) / (g.x[1] - g.x[0])) * g.plot.width,
    py: g.plot.top + (1 - (y - g.y[0]) / (g.y[1] - g.y[0])) * g.plot.height,
  };
}

export function inside(r: Rect, px: number, py: number, slack = 0): boolean {
  return (
    px >= r.left - slack &&
    px <= r.left + r.width + slack &&
    py >= r.top - slack &&
    py <= r.top + r.height + slack
  );
}

/** The index of the drawn point nearest to (px, py) within `within` pixels, or −1. */
export function nearestPoint(
  g: PanelGeometry,
  xs: readonly (number | null)[],
  ys: readonly (number | null)[],
  px: number,
  py: number,
  within = 14,
): { index: number; distance: number } {
  let best = -1;
  let bestD = within;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const y = ys[i];
    if (x === null || y === null) continue;
    const p = toPixel(g, x, y);
    const d = Math.hypot(p.px - px, p.py - py);
    if (d <= bestD) {
      bestD = d;
      best = i;
    }
  }
  return { index: best, distance: bestD };
}
