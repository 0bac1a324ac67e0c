import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

/** A small invented chain on the demo index (spot 4250): a skewed short end, flatter beyond. */
function chain(): string {
  const rows = ['expiry,strike,impliedVol'];
  for (const [T, atm, skew] of [
    [0.0192, 0.16, -0.9],
    [0.0833, 0.165, -0.55],
    [0.25, 0.17, -0.35],
    [1, 0.18, -0.2],
  ]) {
    for (const m of [-0.15, -0.1, -0.05, 0, 0.05, 0.1]) {
      const k = m * Math.sqrt(T / 0.25);
      rows.push(
        `${T},${(4250 * Math.exp(k)).toFixed(2)},${(atm + skew * k + 0.6 * k * k).toFixed(4)}`,
      );
    }
  }
  rows.push('0.25,oops,0.2');
  return rows.join('\n');
}

describe('Fit', () => {
  it('uploads a quote CSV, fits Bates with progress, and saves the fitted scenario', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
    await page.getByRole('link', { name: 'Fit' }).click();
    await page
      .getByTestId('quotes-file')
      .setInputFiles({ name: 'chain.csv', mimeType: 'text/csv', buffer: Buffer.from(chain()) });
    await expect
      .poll(() => page.getByTestId('quotes-summary').textContent())
      .toBe('24 quotes kept over 4 expiries, 1 rows rejected.');
    await page.getByRole('button', { name: 'Fit Bates' }).click();
    await expect.poll(() => page.getByTestId('fit-quality').count(), { timeout: 45000 }).toBe(1);
    expect(await page.getByTestId('fit-quality').textContent()).toMatch(
      /RMSE \d+\.\d{3} vol points/,
    );
    await page.getByRole('button', { name: 'Save as scenario' }).click();
    await page.getByTestId('saved-scenario-link').click();
    await expect
      .poll(() => page.getByLabel('Scenario name').inputValue(), { timeout: 20000 })
      .toMatch(/fitted Bates$/);
    expect(errors).toEqual([]);
    await context.close();
  });
});
