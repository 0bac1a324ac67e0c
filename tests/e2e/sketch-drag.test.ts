/**
 * A fast drag on Sketch: many slider steps in a row, faster than the engine answers. When it
 * stops, the smile panels (their last painted state, by the page's `sketch:painted` mark) and
 * the expiry table show exactly the final position: the table's stressed vols are the engine's
 * answer for that stress, digit for digit.
 */
import { describe, expect, it } from 'vitest';
import { formatVol } from '../../src/components/format';
import { smileRequest } from '../../src/features/sketch/hooks/use-smiles';
import { demoScenarios } from '../../src/store/demo-scenarios';
import { computeSmiles } from '../../src/workers/engine-handlers';
import { appAndBrowser, openSketch } from './harness';

const env = appAndBrowser();

describe('Sketch under a fast drag', () => {
  it('ends on the final position in the smile panels and in the table', async () => {
    const { context, page, errors } = await openSketch(env);
    await page.evaluate(() => {
      const w = window as unknown as { painted: string[] };
      w.painted = [];
      new PerformanceObserver((list) => {
        for (const e of list.getEntries())
          if (e.name === 'sketch:painted')
            w.painted.push((e as PerformanceMark).detail.stress as string);
      }).observe({ type: 'mark' });
    });
    const slider = page.getByTestId('stress-jumpMeanShift');
    await slider.focus();
    for (let i = 0; i < 15; i++) await page.keyboard.press('ArrowLeft', { delay: 0 });
    const final = Number(await slider.inputValue());
    expect(final).toBeCloseTo(-0.075, 12);
    const lastPainted = () =>
      page.evaluate(() => {
        const p = (window as unknown as { painted: string[] }).painted;
        return p.length ? (JSON.parse(p[p.length - 1]) as { jumpMeanShift?: number }) : null;
      });
    await expect
      .poll(async () => (await lastPainted())?.jumpMeanShift, { timeout: 30000 })
      .toBe(final);

    // the engine's answer for the final position, as the table shows it
    const doc = demoScenarios(new Date().toISOString().slice(0, 10))[0];
    const request = smileRequest(
      { ...doc, stress: { ...doc.stress!, jumpMeanShift: final } },
      doc.grid.expiries[0],
    );
    const expected = computeSmiles(request).stressed!.slices[0].impliedVols.map((v) =>
      formatVol(v),
    );
    const stressedColumn = () =>
      page
        .getByTestId('smile-table')
        .locator('tbody tr')
        .evaluateAll((rows) => rows.map((r) => r.querySelectorAll('td')[4]?.textContent ?? ''));
    await expect.poll(stressedColumn, { timeout: 30000 }).toEqual(expected);
    expect(await page.getByTestId('smile-chart').getAttribute('data-stressed')).toBe('yes');
    expect(errors).toEqual([]);
    await context.close();
  });
});
