import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();

describe('the app shell', () => {
  it('loads with the service status, then still loads offline after a reload', async () => {
    const context = await env.browser().newContext();
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect
      .poll(() => page.getByRole('link', { name: 'Saltation home' }).isVisible())
      .toBe(true);
    await expect
      .poll(() => page.getByTestId('service-status').getAttribute('data-state'), { timeout: 15000 })
      .toBe('online');
    // the service worker precaches the shell on install; it controls the page from the next load
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await page.reload();
    await expect
      .poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null))
      .toBe(true);
    await context.setOffline(true);
    await page.reload();
    await expect.poll(() => page.getByRole('navigation', { name: 'Pages' }).isVisible()).toBe(true);
    await expect
      .poll(() => page.getByTestId('service-status').getAttribute('data-state'), { timeout: 15000 })
      .toBe('offline');
    await page.getByRole('link', { name: 'Fit' }).click();
    await expect.poll(() => page.getByRole('heading', { name: 'Fit' }).isVisible()).toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('keeps a scenario created in the Library across a reload', async () => {
    const context = await env.browser().newContext();
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(`${env.app().url}/library`);
    const name = `Weekly crash ladder ${Date.now()}`;
    await page.getByLabel('New scenario').fill(name);
    await page.getByRole('button', { name: 'Create' }).click();
    await expect.poll(() => page.getByRole('link', { name }).count()).toBe(1);
    await page.reload();
    await expect.poll(() => page.getByRole('link', { name }).count()).toBe(1);
    const row = page.getByTestId('scenario-row').filter({ hasText: name });
    await expect.poll(() => row.getByTestId('sync-state').getAttribute('data-state')).toBe('local');
    expect(errors).toEqual([]);
    await context.close();
  });
});
