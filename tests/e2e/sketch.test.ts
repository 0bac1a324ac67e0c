import { describe, expect, it } from 'vitest';
import { appAndBrowser, openSketch, trackErrors } from './harness';

const env = appAndBrowser();

describe('Sketch', () => {
  it('draws the stressed smile and fills the stressed column when a stress slider is dragged', async () => {
    const { context, page, errors } = await openSketch(env);
    const chart = page.getByTestId('smile-chart');
    await expect.poll(() => chart.getAttribute('data-stressed'), { timeout: 20000 }).toBe('no');
    const cellBefore = await page
      .getByTestId('smile-table')
      .locator('tbody tr')
      .first()
      .locator('td')
      .nth(4)
      .textContent();
    expect(cellBefore).toBe('—');

    const slider = page.getByTestId('stress-jumpMeanShift');
    await slider.scrollIntoViewIfNeeded();
    const box = (await slider.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.75, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.4, box.y + box.height / 2, { steps: 8 });
    await page.mouse.up();

    await expect.poll(() => chart.getAttribute('data-stressed'), { timeout: 20000 }).toBe('yes');
    const stressedCell = page
      .getByTestId('smile-table')
      .locator('tbody tr')
      .first()
      .locator('td')
      .nth(4);
    await expect.poll(() => stressedCell.textContent(), { timeout: 20000 }).toMatch(/^\d+\.\d\d$/);
    // a deeper mean jump lifts the far put wing
    const change = await page
      .getByTestId('smile-table')
      .locator('tbody tr')
      .first()
      .locator('td')
      .nth(5)
      .textContent();
    expect(Number(change)).toBeGreaterThan(0);
    await expect
      .poll(() => page.getByTestId('save-state').getAttribute('data-state'), { timeout: 10000 })
      .toBe('saved');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('solves the jumps to placed target vols and opens the new stressed scenario', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect
      .poll(() => page.getByTestId('smile-chart').getAttribute('data-stressed'), { timeout: 20000 })
      .not.toBeNull();
    const panel = page.getByTestId('target-vols');
    await panel.scrollIntoViewIfNeeded();
    for (const [k, v] of [
      ['-0.1', '34'],
      ['0', '16'],
      ['0.05', '15'],
    ]) {
      await page.getByLabel('Target ln(K/F)').fill(k);
      await page.getByLabel('Target vol %').fill(v);
      await panel.getByRole('button', { name: 'Place' }).click();
    }
    await expect.poll(() => panel.locator('li').count()).toBe(3);
    // a click on a smile picks its expiry, strike and vol into the entry (the typed entry works too)
    await page.getByTestId('smile-chart').scrollIntoViewIfNeeded();
    // the 1D panel's base smile, 30 % along its points, where the canvas drew it
    const point = await page.evaluate(() => {
      const canvas = document.querySelector<HTMLCanvasElement>('[data-testid="smile-canvas"]')!;
      const panels = JSON.parse(canvas.dataset.panels!) as {
        plot: { left: number; top: number; width: number; height: number };
        x: [number, number];
        y: [number, number];
      }[];
      const g = panels[0];
      const row = document.querySelectorAll('[data-testid="smile-table"] tbody tr')[12];
      const k = Number(row.querySelectorAll('td')[1].textContent);
      const vol = Number(row.querySelectorAll('td')[3].textContent);
      const box = canvas.getBoundingClientRect();
      return {
        x: box.left + g.plot.left + ((k - g.x[0]) / (g.x[1] - g.x[0])) * g.plot.width,
        y: box.top + g.plot.top + (1 - (vol - g.y[0]) / (g.y[1] - g.y[0])) * g.plot.height,
      };
    });
    await page.mouse.click(point.x, point.y);
    await expect
      .poll(() => page.getByLabel('Target vol %').inputValue(), { timeout: 5000 })
      .toMatch(/^\d+\.\d\d$/);
    expect(Number(await page.getByLabel('Target ln(K/F)').inputValue())).toBeLessThan(0);
    await panel.getByRole('button', { name: 'Solve jumps' }).click();
    await expect
      .poll(() => page.getByLabel('Scenario name').inputValue(), { timeout: 30000 })
      .toMatch(/solved to targets$/);
    expect(errors).toEqual([]);
    await context.close();
  });
});
