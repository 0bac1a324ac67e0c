import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();
const shots = process.env.SALTATION_SHOTS;

/** A table cell's text as a number ("-1,474.3780" → -1474.378). */
const num = (text: string | null) => Number((text ?? '').replace(/,/g, ''));

describe('Wing hedge', () => {
  it('a short put on the Book gets a suggested wing overlay, and Replay runs it on the same paths with a smaller ES99', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
    // the replay's path count is the Replay form's: keep the run short
    await page.getByRole('link', { name: 'Replay' }).click();
    await page.getByLabel('Paths', { exact: true }).fill('4096');

    await page.getByRole('link', { name: 'Book' }).click();
    await page.getByLabel('New book name').fill('Short put wing');
    await page.getByRole('button', { name: 'Create' }).click();
    await expect
      .poll(() =>
        page.getByLabel('Open book').evaluate((s: HTMLSelectElement) => s.selectedOptions[0]?.text),
      )
      .toMatch(/Short put wing/);
    const csv = 'id,type,strike,expiry,quantity,tradePrice\nshort-put-1m,put,4000,0.0822,-10,\n';
    await page
      .getByTestId('positions-file')
      .setInputFiles({ name: 'book.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByRole('button', { name: /Replace book with 1 leg/ }).click();
    await expect
      .poll(() => page.getByTestId('expected-jump-pnl').textContent(), { timeout: 30000 })
      .toMatch(/Expected jump P&L a year: -[\d,.]+/);

    // a bad choice is refused, then the pilot finds the overlay
    await page.getByLabel('Wing put strikes').fill('3900');
    await page.getByRole('button', { name: 'Suggest a wing hedge' }).click();
    await expect
      .poll(() => page.getByTestId('wing-hedge').getByRole('alert').textContent())
      .toBe('Strikes: give 2 to 4 put strikes.');
    await page.getByLabel('Wing put strikes').fill('3825, 3952.5, 4080');
    await page.getByLabel('Wing premium budget').fill('300');
    await page.getByRole('button', { name: 'Suggest a wing hedge' }).click();
    const summary = page.getByTestId('wing-summary');
    await expect.poll(() => summary.count(), { timeout: 60000 }).toBe(1);
    const premium = num(((await summary.textContent()) ?? '').match(/Premium paid ([\d,.]+)/)![1]);
    expect(premium).toBeGreaterThan(0);
    expect(premium).toBeLessThanOrEqual(300);
    if (shots) await page.screenshot({ path: `${shots}/book-wing-hedge.png`, fullPage: true });

    await page.getByRole('button', { name: 'Replay with this overlay' }).click();
    const stats = page.getByTestId('replay-stats');
    await expect.poll(() => stats.count(), { timeout: 120000 }).toBe(1);
    const header = await stats.locator('thead th').allTextContents();
    expect(header.slice(1)).toEqual([
      'model delta, 1× a day, 1 bp',
      'model delta, 1× a day, 1 bp + overlay',
      'Black-Scholes delta, 1× a day, 1 bp',
      'Black-Scholes delta, 1× a day, 1 bp + overlay',
    ]);
    // the overlay came with the seed it was found on
    expect(await page.getByTestId('replay-summary').textContent()).toContain('seed 20261202');
    const es = await stats
      .locator('tr', { hasText: '99 % expected shortfall' })
      .locator('td')
      .allTextContents();
    const [before, after] = [num(es[1]), num(es[2])];
    expect(before).toBeLessThan(0);
    expect(after).toBeGreaterThan(before); // a smaller loss
    // both histograms, before and after, on shared bins
    const legend = page.locator('[data-testid="replay-charts"] .legendtext');
    await expect
      .poll(() => legend.allTextContents(), { timeout: 30000 })
      .toContain('model delta + overlay');
    expect(await legend.allTextContents()).toContain('model delta');
    if (shots) await page.screenshot({ path: `${shots}/replay-wing-overlay.png`, fullPage: true });
    expect(errors).toEqual([]);
    await context.close();
  });
});
