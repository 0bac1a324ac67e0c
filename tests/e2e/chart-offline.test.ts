import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

describe('a chart that cannot load', () => {
  it('says so and keeps the page working, and loads when asked again', async () => {
    const context = await env.browser().newContext({
      viewport: { width: 1400, height: 1000 },
      serviceWorkers: 'block',
    });
    const page = await context.newPage();
    const errors = trackErrors(page);
    // the chart library's chunk cannot be fetched, as offline before the service worker has it
    await page.route(/plotly/i, (route) => route.abort());
    await page.goto(env.app().url);
    const notice = page.getByText('The chart could not be loaded');
    await expect.poll(() => notice.count(), { timeout: 20000 }).toBeGreaterThan(0);
    await page.getByRole('link', { name: 'Library' }).click();
    await expect
      .poll(() => page.getByRole('heading', { name: 'Library' }).count(), { timeout: 10000 })
      .toBe(1);
    await page.unroute(/plotly/i);
    await page.getByRole('link', { name: 'Sketch' }).click();
    await page.getByRole('button', { name: 'Try again' }).first().click();
    await expect
      .poll(() => page.locator('.main-svg').count(), {
        timeout: 30000,
      })
      .toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await context.close();
  });
});
