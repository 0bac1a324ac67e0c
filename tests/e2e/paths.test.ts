import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

describe('Paths', () => {
  it('runs a simulation to 100 %, then after a reload reopens the same run from the cache', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
    await page.getByRole('link', { name: 'Paths' }).click();
    await page.getByLabel('Paths', { exact: true }).fill('8192');
    await page.getByRole('button', { name: 'Simulate' }).click();
    const summary = page.getByTestId('paths-summary');
    await expect.poll(() => summary.getAttribute('data-from-cache'), { timeout: 60000 }).toBe('no');
    expect(await summary.getAttribute('data-final-progress')).toBe('100');
    await expect.poll(() => page.getByTestId('mc-table').locator('tbody tr').count()).toBe(3);
    await expect
      .poll(() => page.locator('[data-testid="paths-charts"] .main-svg').count(), {
        timeout: 30000,
      })
      .toBeGreaterThan(3);
    const first = await page.getByTestId('mc-table').locator('tbody tr').first().textContent();

    await page.reload();
    await page.getByLabel('Paths', { exact: true }).fill('8192');
    await page.getByRole('button', { name: 'Simulate' }).click();
    await expect
      .poll(() => summary.getAttribute('data-from-cache'), { timeout: 20000 })
      .toBe('yes');
    expect(await page.getByTestId('mc-table').locator('tbody tr').first().textContent()).toBe(
      first,
    );
    expect(errors).toEqual([]);
    await context.close();
  });

  it('cancels a long run at once and keeps nothing of it in the cache', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(`${env.app().url}/paths`);
    await page.getByLabel('Paths', { exact: true }).fill('2000000');
    await page.getByLabel('Steps per day', { exact: true }).fill('4');
    await page.getByRole('button', { name: 'Simulate' }).click();
    await expect.poll(() => page.getByTestId('paths-progress').count(), { timeout: 20000 }).toBe(1);
    const before = await page.getByText(/^Cache: /).textContent();
    await page.getByRole('button', { name: 'Cancel' }).click();
    await expect
      .poll(() => page.getByRole('alert').textContent(), { timeout: 5000 })
      .toBe('Cancelled: nothing was kept.');
    expect(await page.getByTestId('paths-progress').count()).toBe(0);
    expect(await page.getByText(/^Cache: /).textContent()).toBe(before);
    expect(errors).toEqual([]);
    await context.close();
  });
});
