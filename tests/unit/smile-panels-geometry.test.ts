/**
 * The geometry of Sketch's canvas smile panels: panels in a grid, nice ticks, the vol axis held
 * while a drag stays inside it, and the point under the pointer (what a click picks).
 */
import { describe, expect, it } from 'vitest';
import {
  nearestPoint,
  niceStep,
  panelGrid,
  panelRect,
  ticks,
  toPixel,
  volRange,
  type PanelGeometry,
} from '../../src/features/sketch/smile-panels-geometry';

describe('smile panel geometry', () => {
  it('lays 1–4 expiries in one row and more in rows of three', () => {
    expect(panelGrid(1)).toEqual({ columns: 1, rows: 1 });
    expect(panelGrid(4)).toEqual({ columns: 4, rows: 1 });
    expect(panelGrid(5)).toEqual({ columns: 3, rows: 2 });
    expect(panelGrid(7)).toEqual({ columns: 3, rows: 3 });
    const a = panelRect(0, 5, 900);
    const b = panelRect(4, 5, 900);
    expect(b.left - a.left).toBe(300); // second column of the second row
    expect(b.top).toBeGreaterThan(a.top + a.height);
  });

  it('ticks at 1, 2 or 5 × 10^k inside the range', () => {
    expect(niceStep(0, 100)).toBe(50);
    expect(niceStep(12, 48)).toBe(10);
    expect(ticks(12, 48)).toEqual([20, 30, 40]);
    expect(ticks(-0.3, 0.3)).toEqual([-0.2, 0, 0.2]);
    expect(ticks(0.9, 0.1)).toEqual([0.2, 0.4, 0.6, 0.8]); // a reversed axis ticks the same
  });

  it('holds the vol axis while the data stays inside it and fills half of it', () => {
    const first = volRange([15, 40], null);
    expect(first[0]).toBeLessThanOrEqual(15);
    expect(first[1]).toBeGreaterThanOrEqual(40);
    expect(volRange([16, 38], first)).toBe(first); // a small step of a drag: same axis
    expect(volRange([16, 60], first)).not.toBe(first); // outside: a new axis
    expect(volRange([20, 22], first)).not.toBe(first); // shrunk to a sliver: a new axis
    expect(volRange([null, null], first)).toBe(first);
  });

  it('finds the drawn point under the pointer, and none far from every point', () => {
    const g: PanelGeometry = {
      plot: { left: 50, top: 30, width: 200, height: 100 },
      x: [-0.2, 0.2],
      y: [0, 50],
    };
    expect(toPixel(g, -0.2, 50)).toEqual({ px: 50, py: 30 });
    expect(toPixel(g, 0.2, 0)).toEqual({ px: 250, py: 130 });
    const xs = [-0.2, -0.1, 0, 0.1, 0.2];
    const ys = [40, 30, null, 22, 25];
    const p = toPixel(g, -0.1, 30);
    expect(nearestPoint(g, xs, ys, p.px + 3, p.py - 2).index).toBe(1);
    // the point without a vol is never picked
    const gap = toPixel(g, 0, 25);
    expect(nearestPoint(g, xs, ys, gap.px, gap.py, 5).index).toBe(-1);
    // reversed x (the delta view): left is the larger value
    const rev: PanelGeometry = { ...g, x: [1, 0] };
    expect(toPixel(rev, 1, 0).px).toBe(50);
  });
});
