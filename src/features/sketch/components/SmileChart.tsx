/**
 * Base and stressed smiles, one small panel per expiry, drawn on one canvas: a slider step
 * redraws a few hundred line segments in a millisecond or two, where a chart library lays out
 * every panel and axis again. At most one draw per animation frame (the newest props win); the
 * vol axes hold their range while a drag stays inside it. Hovering shows a point's vol; a click
 * picks its expiry, ln(K/F) and vol (`onPick`).
 */
import { useEffect, useRef } from 'react';
import { normCdf, type SmileSlice, type SmileSurface } from '../../../engine/analytic';
import type { TargetVol } from '../../../engine/fit';
import { chartTheme, type ChartTheme } from '../../../components/chart-theme';
import { useTheme } from '../../../components/theme';
import { formatTenor } from '../../../components/format';
import {
  LEGEND_HEIGHT,
  PANEL_HEIGHT,
  extent,
  inside,
  nearestPoint,
  panelGrid,
  panelRect,
  ticks,
  toPixel,
  volRange,
  type PanelGeometry,
} from '../smile-panels-geometry';

export type AxisMode = 'strike' | 'moneyness' | 'delta';

export const AXIS_LABEL: Record<AxisMode, string> = {
  strike: 'Strike',
  moneyness: 'Log-moneyness ln(K/F)',
  delta: 'Call delta (forward)',
};

function xValues(slice: SmileSlice, mode: AxisMode): (number | null)[] {
  if (mode === 'strike') return slice.strikes;
  if (mode === 'moneyness') return slice.logMoneyness;
  return slice.callDeltas;
}

const vols = (s: SmileSlice | undefined) =>
  s ? s.impliedVols.map((v) => (v === null ? null : 100 * v)) : [];

function targetX(t: TargetVol, slice: SmileSlice, mode: AxisMode): number {
  if (mode === 'moneyness') return t.logMoneyness;
  if (mode === 'strike') return slice.forward * Math.exp(t.logMoneyness);
  const sd = t.impliedVol * Math.sqrt(slice.expiry);
  return normCdf(-t.logMoneyness / sd + 0.5 * sd);
}

const NO_TARGETS: TargetVol[] = [];
const FONT = "'Source Sans 3', sans-serif";

interface Props {
  base: SmileSurface;
  stressed: SmileSurface | null;
  mode: AxisMode;
  targets?: TargetVol[];
  /** a click on a smile: its panel's expiry, the point's ln(K/F) and vol */
  onPick?: (p: { expiry: number; logMoneyness: number; impliedVol: number }) => void;
  /** called inside the animation frame that drew a new state (before it is painted) */
  onPainted?: () => void;
}

interface Drawn {
  geometry: PanelGeometry[];
  props: Props;
}

function tickLabel(v: number, mode: AxisMode | 'vol'): string {
  if (mode === 'vol') return `${Number(v.toFixed(1))}%`;
  if (mode === 'strike') return v.toLocaleString('en-US', { maximumFractionDigits: 0 });
  return String(Number(v.toFixed(3)));
}

function draw(
  ctx: CanvasRenderingContext2D,
  width: number,
  props: Props,
  held: ([number, number] | null)[],
  t: ChartTheme,
): PanelGeometry[] {
  const { base, stressed, mode } = props;
  const targets = props.targets ?? NO_TARGETS;
  const n = base.slices.length;
  const { rows } = panelGrid(n);
  ctx.clearRect(0, 0, width, LEGEND_HEIGHT + rows * PANEL_HEIGHT);
  ctx.font = `12px ${FONT}`;
  ctx.textBaseline = 'middle';
  // legend
  const legend = (x: number, color: string, dash: number[], label: string) => {
    ctx.strokeStyle = color;
    ctx.lineWidth = 2;
    ctx.setLineDash(dash);
    ctx.beginPath();
    ctx.moveTo(x, 12);
    ctx.lineTo(x + 26, 12);
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.fillStyle = t.ink;
    ctx.textAlign = 'left';
    ctx.fillText(label, x + 32, 12);
  };
  legend(46, t.base, [], 'base');
  if (stressed) legend(130, t.stressed, [6, 4], 'stressed');

  const geometry: PanelGeometry[] = [];
  base.slices.forEach((slice, i) => {
    const s = stressed?.slices[i];
    const here = targets.filter((x) => Math.abs(x.expiry - slice.expiry) < 1e-9);
    const xs = xValues(slice, mode);
    // the x range covers the points drawn (a strike without a vol is not drawn)
    const drawnX = (c: SmileSlice) => xValues(c, mode).filter((_, k) => c.impliedVols[k] !== null);
    const ex =
      extent([
        ...drawnX(slice),
        ...(s ? drawnX(s) : []),
        ...here.map((x) => targetX(x, slice, mode)),
      ]) ?? ([0, 1] as [number, number]);
    const pad = 0.02 * (ex[1] - ex[0] || 1);
    const x: [number, number] =
      mode === 'delta' ? [ex[1] + pad, ex[0] - pad] : [ex[0] - pad, ex[1] + pad];
    const y = volRange(
      [...vols(slice), ...vols(s), ...here.map((v) => 100 * v.impliedVol)],
      held[i],
    );
    held[i] = y;
    const g: PanelGeometry = { plot: panelRect(i, n, width), x, y };
    geometry.push(g);
    const { plot } = g;
    // grid and tick labels
    ctx.lineWidth = 1;
    ctx.strokeStyle = t.grid;
    ctx.fillStyle = t.muted;
    ctx.font = `11px ${FONT}`;
    ctx.textAlign = 'right';
    for (const v of ticks(y[0], y[1])) {
      const { py } = toPixel(g, x[0], v);
      ctx.beginPath();
      ctx.moveTo(plot.left, Math.round(py) + 0.5);
      ctx.lineTo(plot.left + plot.width, Math.round(py) + 0.5);
      ctx.stroke();
      ctx.fillText(tickLabel(v, 'vol'), plot.left - 5, py);
    }
    ctx.textAlign = 'center';
    for (const v of ticks(x[0], x[1], 4)) {
      const { px } = toPixel(g, v, y[0]);
      ctx.beginPath();
      ctx.moveTo(Math.round(px) + 0.5, plot.top);
      ctx.lineTo(Math.round(px) + 0.5, plot.top + plot.height);
      ctx.stroke();
      ctx.fillText(tickLabel(v, mode), px, plot.top + plot.height + 12);
    }
    ctx.strokeRect(plot.left + 0.5, plot.top + 0.5, plot.width, plot.height);
    ctx.fillStyle = t.ink;
    ctx.font = `bold 13px ${FONT}`;
    ctx.textAlign = 'left';
    ctx.fillText(formatTenor(slice.expiry), plot.left, plot.top - 12);
    // the smiles, clipped to the panel
    ctx.save();
    ctx.beginPath();
    ctx.rect(plot.left, plot.top, plot.width, plot.height);
    ctx.clip();
    const line = (xv: (number | null)[], yv: (number | null)[], color: string, dash: number[]) => {
      ctx.strokeStyle = color;
      ctx.lineWidth = 2;
      ctx.setLineDash(dash);
      ctx.beginPath();
      let open = false;
      for (let k = 0; k < xv.length; k++) {
        const a = xv[k];
        const b = yv[k];
        if (a === null || b === null) {
          open = false;
          continue;
        }
        const p = toPixel(g, a, b);
        if (open) ctx.lineTo(p.px, p.py);
        else ctx.moveTo(p.px, p.py);
        open = true;
      }
      ctx.stroke();
      ctx.setLineDash([]);
    };
    line(xs, vols(slice), t.base, []);
    if (s) line(xValues(s, mode), vols(s), t.stressed, [6, 4]);
    ctx.fillStyle = t.teal;
    for (const target of here) {
      const p = toPixel(g, targetX(target, slice, mode), 100 * target.impliedVol);
      ctx.beginPath();
      ctx.moveTo(p.px, p.py - 6);
      ctx.lineTo(p.px + 6, p.py);
      ctx.lineTo(p.px, p.py + 6);
      ctx.lineTo(p.px - 6, p.py);
      ctx.closePath();
      ctx.fill();
    }
    ctx.restore();
  });
  return geometry;
}

/** The drawn point under the pointer: its surface ("base" or "stressed"), panel and index. */
function hit(d: Drawn, px: number, py: number) {
  let best: { which: 'base' | 'stressed'; panel: number; index: number; distance: number } | null =
    null;
  d.geometry.forEach((g, panel) => {
    if (!inside(g.plot, px, py, 8)) return;
    for (const which of ['base', 'stressed'] as const) {
      const slice = (which === 'base' ? d.props.base : d.props.stressed)?.slices[panel];
      if (!slice) continue;
      const near = nearestPoint(g, xValues(slice, d.props.mode), vols(slice), px, py);
      if (near.index >= 0 && (!best || near.distance < best.distance))
        best = { which, panel, index: near.index, distance: near.distance };
    }
  });
  return best as { which: 'base' | 'stressed'; panel: number; index: number } | null;
}

export function SmileChart(props: Props) {
  const theme = useTheme();
  const box = useRef<HTMLDivElement>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const tip = useRef<HTMLDivElement>(null);
  const latest = useRef(props);
  const drawn = useRef<Drawn | null>(null);
  const held = useRef<([number, number] | null)[]>([]);
  const frame = useRef(0);
  latest.current = props;
  const n = props.base.slices.length;
  const height = LEGEND_HEIGHT + panelGrid(n).rows * PANEL_HEIGHT;
  const targetsKey = JSON.stringify(props.targets ?? NO_TARGETS);

  // the chart's width as its resize observer last saw it (or as first read): reading clientWidth
  // inside every drawing frame would force a layout before the frame's own
  const width = useRef(-1);
  const redrawRef = useRef<() => void>(() => undefined);

  // one frame per change of what is drawn
  useEffect(() => {
    const el = canvas.current;
    const container = box.current;
    if (!el || !container) return;
    const redraw = () => {
      cancelAnimationFrame(frame.current);
      frame.current = requestAnimationFrame(() => {
        const ctx = el.getContext('2d');
        if (width.current < 0) width.current = container.clientWidth;
        const w = width.current;
        if (!ctx || w <= 0) return;
        const ratio = window.devicePixelRatio || 1;
        if (el.width !== Math.round(w * ratio) || el.height !== Math.round(height * ratio)) {
          el.width = Math.round(w * ratio);
          el.height = Math.round(height * ratio);
          el.style.width = `${w}px`;
          el.style.height = `${height}px`;
        }
        ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
        const p = latest.current;
        const geometry = draw(ctx, w, p, held.current, chartTheme(theme));
        drawn.current = { geometry, props: p };
        // an unchanged attribute is not written: a write would restyle the canvas
        const panels = JSON.stringify(geometry);
        if (el.dataset.panels !== panels) el.dataset.panels = panels;
        p.onPainted?.();
      });
    };
    redrawRef.current = redraw;
    redraw();
    return () => cancelAnimationFrame(frame.current);
    // targets by value: a page re-render hands a new (equal) array
  }, [props.base, props.stressed, props.mode, targetsKey, theme, height]);

  // one observer for the chart's life: only a new width redraws (its first report, of the width
  // the first frame read, does not)
  useEffect(() => {
    const container = box.current;
    if (!container) return;
    const observer = new ResizeObserver((entries) => {
      const entry = entries[entries.length - 1];
      if (!entry) return;
      const w = Math.round(entry.contentRect.width);
      if (w === width.current) return;
      width.current = w;
      redrawRef.current();
    });
    observer.observe(container);
    return () => observer.disconnect();
  }, []);

  // a new expiry set or axis starts its vol axes afresh
  useEffect(() => {
    held.current = [];
  }, [props.mode, n]);

  const pointAt = (e: React.MouseEvent) => {
    const d = drawn.current;
    const rect = canvas.current?.getBoundingClientRect();
    if (!d || !rect) return null;
    const h = hit(d, e.clientX - rect.left, e.clientY - rect.top);
    if (!h) return null;
    const slice = (h.which === 'base' ? d.props.base : d.props.stressed)!.slices[h.panel];
    const vol = slice.impliedVols[h.index];
    return vol === null ? null : { h, slice, vol };
  };

  return (
    <div ref={box} className="relative w-full" style={{ height }}>
      <canvas
        ref={canvas}
        data-testid="smile-canvas"
        role="img"
        aria-label="Implied vol smiles, one panel per expiry: base solid, stressed dashed"
        className="cursor-crosshair"
        onMouseMove={(e) => {
          const found = pointAt(e);
          const el = tip.current;
          if (!el) return;
          if (!found) {
            el.hidden = true;
            return;
          }
          const g = drawn.current!.geometry[found.h.panel];
          const xs = xValues(found.slice, drawn.current!.props.mode);
          const p = toPixel(g, xs[found.h.index]!, 100 * found.vol);
          el.hidden = false;
          el.textContent = `${formatTenor(found.slice.expiry)} ${found.h.which}: ${(100 * found.vol).toFixed(2)}% at ln(K/F) ${found.slice.logMoneyness[found.h.index].toFixed(3)}`;
          // left of the point when it would run past the chart's edge (the chart clips its paint)
          const room = (box.current?.clientWidth ?? Infinity) - (p.px + 8);
          const left = el.offsetWidth > room ? p.px - 8 - el.offsetWidth : p.px + 8;
          el.style.left = `${Math.max(0, left)}px`;
          el.style.top = `${p.py - 28}px`;
        }}
        onMouseLeave={() => {
          if (tip.current) tip.current.hidden = true;
        }}
        onClick={(e) => {
          const found = pointAt(e);
          if (!found || !props.onPick) return;
          props.onPick({
            expiry: found.slice.expiry,
            logMoneyness: found.slice.logMoneyness[found.h.index],
            impliedVol: found.vol,
          });
        }}
      />
      <div
        ref={tip}
        hidden
        className="tabular pointer-events-none absolute rounded border border-rule bg-panel px-2 py-0.5 text-xs shadow-sm"
      />
    </div>
  );
}
