/**
 * A first visit shows the product working: the Book opens on the invented demo book with its
 * P&L matrix and gap ladder, the Fit page loads the invented demo chain and fits it, and
 * quotes whose forwards imply another spot are pointed out, with the fix saved consistently.
 */
import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

async function firstVisit() {
  const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
  const page = await context.newPage();
  const errors = trackErrors(page);
  await page.goto(env.app().url);
  await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
  return { context, page, errors };
}

describe('a first visit', () => {
  it('the Book shows the demo book: its legs, the P&L matrix and the gap ladder', async () => {
    const { context, page, errors } = await firstVisit();
    await page.getByRole('link', { name: 'Book' }).click();
    const matrix = page.getByTestId('pnl-matrix');
    await expect.poll(() => matrix.count(), { timeout: 30000 }).toBe(1);
    // the total row and 30 to 40 legs
    const rows = await matrix.locator('tbody tr').count();
    expect(rows - 1).toBeGreaterThanOrEqual(30);
    expect(rows - 1).toBeLessThanOrEqual(41);
    await expect
      .poll(() => page.locator('[data-testid="gap-ladder"] .main-svg').count(), { timeout: 30000 })
      .toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('the Fit page loads the demo chain and fits Bates to it within its noise', async () => {
    const { context, page, errors } = await firstVisit();
    await page.getByRole('link', { name: 'Fit' }).click();
    await page.getByRole('button', { name: 'Load the demo chain' }).click();
    await expect
      .poll(() => page.getByTestId('quotes-summary').textContent())
      .toMatch(/^\d{3} quotes kept over 6 expiries, 0 rows rejected\.$/);
    await page.getByRole('button', { name: 'Fit Bates' }).click();
    await expect.poll(() => page.getByTestId('fit-quality').count(), { timeout: 45000 }).toBe(1);
    const quality = await page.getByTestId('fit-quality').textContent();
    // the chain carries 0.1 vol point of noise and a bid/ask: the fit lands within a few tenths
    expect(Number(quality!.match(/RMSE (\d+\.\d+)/)![1])).toBeLessThan(0.3);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('quotes whose forwards imply another spot are flagged, and the fix is saved with the fit', async () => {
    const { context, page, errors } = await firstVisit();
    await page.getByRole('link', { name: 'Fit' }).click();
    // forwards of a spot of 4470 under the demo index's carry (r 3.1 %, q 1.7 %)
    const rows = ['expiry,strike,impliedVol,forward'];
    for (const T of [0.0833, 0.25, 0.5])
      for (const m of [-0.1, -0.05, 0, 0.05])
        rows.push(
          `${T},${(4470 * Math.exp(m)).toFixed(2)},${(0.17 - 0.4 * m).toFixed(4)},${(4470 * Math.exp(0.014 * T)).toFixed(2)}`,
        );
    await page.getByTestId('quotes-file').setInputFiles({
      name: 'fwd.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(rows.join('\n')),
    });
    const warning = page.getByTestId('spot-mismatch');
    await expect.poll(() => warning.textContent()).toMatch(/imply a spot of 4,470\.00, 5\.2 %/);
    await warning.getByRole('button', { name: /Use spot 4,470\.00/ }).click();
    expect(await warning.count()).toBe(0);
    await page.getByRole('button', { name: 'Fit Bates' }).click();
    await expect.poll(() => page.getByTestId('fit-quality').count(), { timeout: 45000 }).toBe(1);
    await page.getByRole('button', { name: 'Save as scenario' }).click();
    await page.getByTestId('saved-scenario-link').click();
    await expect
      .poll(() => page.getByLabel('Scenario name').inputValue(), { timeout: 20000 })
      .toMatch(/fitted Bates$/);
    expect(Number(await page.getByLabel('Spot', { exact: true }).inputValue())).toBeCloseTo(
      4470,
      2,
    );
    expect(errors).toEqual([]);
    await context.close();
  });
});
