import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

const POSITIONS = [
  'id,type,strike,expiry,quantity,tradePrice',
  'short-put-1w,put,4000,0.0192,-50,',
  'long-put-1m,put,3800,0.0833,80,',
  'call-3m,call,4500,0.25,20,',
  'hedge,underlying,,,10,',
  'broken,put,,0.1,5,',
].join('\n');

describe('Book', () => {
  it('uploads a positions file, picks a scenario set, and shows the P&L matrix and the gap ladder', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url); // the first visit puts the demo desk's scenarios on the device
    await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
    await page.getByRole('link', { name: 'Book' }).click();
    await page.getByLabel('New book name').fill('Weekly crash ladder');
    await page.getByRole('button', { name: 'Create' }).click();
    // the new book is selected (the demo book was there first)
    await expect
      .poll(() =>
        page.getByLabel('Open book').evaluate((s: HTMLSelectElement) => s.selectedOptions[0]?.text),
      )
      .toMatch(/Weekly crash ladder/);

    await page
      .getByTestId('positions-file')
      .setInputFiles({ name: 'book.csv', mimeType: 'text/csv', buffer: Buffer.from(POSITIONS) });
    await expect
      .poll(() => page.getByTestId('positions-parse-summary').textContent())
      .toBe('4 good rows, 1 rejected.');
    await expect
      .poll(() => page.getByLabel('Rejected rows').textContent())
      .toContain('line 6, strike');
    await page.getByRole('button', { name: /Replace book with 4 legs/ }).click();

    const matrix = page.getByTestId('pnl-matrix');
    await expect.poll(() => matrix.count(), { timeout: 30000 }).toBe(1);
    await expect.poll(() => matrix.locator('tbody tr').count()).toBe(5); // total + 4 legs
    const crashTotal = await page.getByTestId('pnl-total').locator('td').nth(1).textContent();
    expect(crashTotal).toMatch(/^-?[\d,]+\.\d\d$/);
    await expect
      .poll(() => page.locator('[data-testid="gap-ladder"] .main-svg').count(), { timeout: 30000 })
      .toBeGreaterThan(0);

    await page.reload();
    await expect
      .poll(() => page.getByTestId('positions-table').locator('tbody tr').count(), {
        timeout: 20000,
      })
      .toBe(4);
    expect(errors).toEqual([]);
    await context.close();
  });
});
