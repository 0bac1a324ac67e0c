/**
 * Chart helpers: a log axis labels every n decades so its labels do not overlap, and theme colours
 * take an opacity the legend can show.
 */
import { describe, expect, it } from 'vitest';
import { logAxisFor, withAlpha } from '../../src/components/chart-theme';

describe('a log axis for its height', () => {
  it('labels every decade when there is room, and every third when 12 decades share 109 px', () => {
    expect(logAxisFor(1e-3, 1, 300).dtick).toBe(1);
    // 109 px hold 4 labels 22 px apart: 1e-15 … 1e-3 in steps of 1e3
    expect(logAxisFor(1e-15, 1e-3, 109).dtick).toBe(3);
    expect(logAxisFor(1e-15, 1e-3, 109).type).toBe('log');
  });

  it('falls back to every decade for an empty or flat range', () => {
    expect(logAxisFor(Infinity, -Infinity, 100).dtick).toBe(1);
    expect(logAxisFor(0.1, 0.1, 100).dtick).toBe(1);
  });
});

describe('a theme colour with an opacity', () => {
  it('turns rgb() and #rrggbb into rgba()', () => {
    expect(withAlpha('rgb(15,118,110)', 0.45)).toBe('rgba(15,118,110,0.45)');
    expect(withAlpha('#0F766E', 0.5)).toBe('rgba(15,118,110,0.5)');
  });
});
