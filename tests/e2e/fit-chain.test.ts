import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

describe('Fit on a chain of calls and puts with bid and ask', () => {
  it('reads the forwards by parity, lists arbitrage, fits against bid–ask bars, and keeps the fit in the history', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
    await page.getByRole('link', { name: 'Fit' }).click();
    // the invented demo chain quotes both sides of each strike
    await page.getByRole('button', { name: 'Load the demo chain' }).click();
    const forwards = page.getByTestId('chain-forwards');
    await expect.poll(() => forwards.locator('tbody tr').count(), { timeout: 20000 }).toBe(6);
    // each forward lies within 0.1 % of the demo index's forward (spot 4,250, carry 1.4 %)
    const first = Number(
      (await forwards.locator('tbody tr').first().locator('td').nth(1).textContent())!.replace(
        /,/g,
        '',
      ),
    );
    expect(Math.abs(first / 4250 - 1)).toBeLessThan(0.002);
    await expect.poll(() => page.getByTestId('arbitrage-flags').count()).toBe(1);

    await page.getByRole('button', { name: 'Fit Bates' }).click();
    await expect.poll(() => page.getByTestId('fit-quality').count(), { timeout: 60000 }).toBe(1);
    expect(await page.getByTestId('within-spread').textContent()).toMatch(
      /Within the bid–ask spread: 1W \d+ %/,
    );
    const legend = await page.locator('.legendtext').allTextContents();
    expect(legend).toContain('bid–ask');

    await page.getByRole('button', { name: /Add to the calibration history of/ }).click();
    await expect
      .poll(() => page.locator('[data-testid="fit-history-chart"] .main-svg').count(), {
        timeout: 20000,
      })
      .toBeGreaterThan(0);
    // the history is kept in the scenario: it is there after a reload
    await page.reload();
    await expect
      .poll(() => page.locator('[data-testid="fit-history-chart"] .main-svg').count(), {
        timeout: 20000,
      })
      .toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await context.close();
  });
});
