import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_SETS, DEMO_USERS } from '../../server/demo';
import { appAndBrowser, scenarioRow, signIn, syncStateOf, trackErrors } from './harness';

const env = appAndBrowser();
const shots = process.env.SALTATION_SHOTS;
const [, trader, analyst] = DEMO_USERS;
const shared = DEMO_SETS[0].scenarios[0];

const row = (page: Page) => scenarioRow(page, shared.id);
const stateOf = (page: Page) => syncStateOf(page, shared.id);

describe('desk sync in the browser', () => {
  it('a trader edits a shared scenario offline and it syncs when back online; the analyst sees it and is refused an edit', async () => {
    const traderContext = await env
      .browser()
      .newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await signIn(env.app(), traderContext, trader);
    const errors = trackErrors(page);
    await expect.poll(() => stateOf(page), { timeout: 30000 }).toBe('synced');

    await row(page).getByRole('link', { name: shared.name }).click();
    const intensity = page.getByLabel('Intensity λ (per year)');
    await expect.poll(() => intensity.count(), { timeout: 20000 }).toBe(1);
    await traderContext.setOffline(true);
    await intensity.fill('0.77');
    await page.getByRole('link', { name: 'Library' }).click();
    await expect.poll(() => stateOf(page), { timeout: 20000 }).toBe('pending');
    if (shots) await page.screenshot({ path: `${shots}/library-offline.png`, fullPage: true });
    await traderContext.setOffline(false);
    await expect.poll(() => stateOf(page), { timeout: 30000 }).toBe('synced');

    const analystContext = await env
      .browser()
      .newContext({ viewport: { width: 1400, height: 1000 } });
    const other = await signIn(env.app(), analystContext, analyst);
    const otherErrors = trackErrors(other);
    await expect.poll(() => stateOf(other), { timeout: 30000 }).toBe('synced');
    await row(other).getByRole('button', { name: 'History' }).click();
    await expect
      .poll(() => other.getByTestId('history').locator('li').count(), { timeout: 20000 })
      .toBe(2);
    expect(await other.getByTestId('history').locator('li').first().textContent()).toContain(
      'Jonas Okafor',
    );
    await row(other).getByRole('link', { name: shared.name }).click();
    const theirs = other.getByLabel('Intensity λ (per year)');
    await expect.poll(() => theirs.inputValue(), { timeout: 20000 }).toBe('0.77');
    await expect.poll(() => other.getByTestId('read-only-note').count()).toBe(1);
    // the analyst's edit is refused by the service and kept as a device-only copy
    await theirs.fill('0.5');
    await other.getByRole('link', { name: 'Library' }).click();
    const copy = other.locator(
      '[data-testid="scenario-group"][data-set="device"] [data-testid="scenario-row"]',
      {
        hasText: `${shared.name} (my edit)`,
      },
    );
    await expect.poll(() => copy.count(), { timeout: 30000 }).toBe(1);
    await expect.poll(() => stateOf(other), { timeout: 20000 }).toBe('synced');
    await row(other).getByRole('link', { name: shared.name }).click();
    await expect
      .poll(() => other.getByLabel('Intensity λ (per year)').inputValue(), { timeout: 20000 })
      .toBe('0.77');
    if (shots) await other.screenshot({ path: `${shots}/analyst-sketch.png`, fullPage: true });
    expect([...errors, ...otherErrors]).toEqual([]);
    await traderContext.close();
    await analystContext.close();
  });
});
