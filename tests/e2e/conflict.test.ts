import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_SETS, DEMO_USERS } from '../../server/demo';
import { appAndBrowser, scenarioRow, signIn, syncStateOf, trackErrors } from './harness';

const env = appAndBrowser();
const shots = process.env.SALTATION_SHOTS;
const [lead, trader] = DEMO_USERS;
const shared = DEMO_SETS[0].scenarios[1];

const row = (page: Page) => scenarioRow(page, shared.id);
const stateOf = (page: Page) => syncStateOf(page, shared.id);

async function editOffline(context: BrowserContext, page: Page, intensity: string) {
  await row(page).getByRole('link', { name: shared.name }).click();
  const field = page.getByLabel('Intensity λ (per year)');
  await expect.poll(() => field.count(), { timeout: 20000 }).toBe(1);
  await context.setOffline(true);
  await field.fill(intensity);
  await page.getByRole('link', { name: 'Library' }).click();
  await expect.poll(() => stateOf(page), { timeout: 20000 }).toBe('pending');
}

describe('a conflict in the browser', () => {
  it('two offline edits of one shared scenario: the second to arrive is a conflict, resolved by keeping both; an old revision is restored as new', async () => {
    const leadContext = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const traderContext = await env
      .browser()
      .newContext({ viewport: { width: 1400, height: 1000 } });
    const mine = await signIn(env.app(), leadContext, lead);
    const theirs = await signIn(env.app(), traderContext, trader);
    const errors = [...trackErrors(mine), ...trackErrors(theirs)];
    for (const p of [mine, theirs])
      await expect.poll(() => stateOf(p), { timeout: 30000 }).toBe('synced');

    await editOffline(traderContext, theirs, '0.9');
    await editOffline(leadContext, mine, '1.2');
    await traderContext.setOffline(false);
    await expect.poll(() => stateOf(theirs), { timeout: 30000 }).toBe('synced');
    await leadContext.setOffline(false);
    await expect.poll(() => stateOf(mine), { timeout: 30000 }).toBe('conflict');

    await row(mine).getByRole('button', { name: 'Resolve' }).click();
    const panel = mine.getByTestId('conflict-panel');
    const diff = await panel.locator('tbody tr').allTextContents();
    expect(diff).toEqual(['Intensity λ (per year)1.20.9']);
    if (shots) await mine.screenshot({ path: `${shots}/conflict.png`, fullPage: true });
    await panel.getByRole('button', { name: 'Keep both (mine as a copy)' }).click();
    const copy = mine
      .getByTestId('scenario-row')
      .filter({ hasText: `${shared.name} (my version)` });
    await expect
      .poll(() => copy.getByTestId('sync-state').getAttribute('data-state'), { timeout: 30000 })
      .toBe('synced');
    await expect.poll(() => stateOf(mine), { timeout: 30000 }).toBe('synced');

    // the shared one now holds the trader's edit; the lead restores the first revision
    await row(mine).getByRole('button', { name: 'History' }).click();
    const history = mine.getByTestId('history');
    await expect.poll(() => history.locator('li').count(), { timeout: 20000 }).toBe(2);
    await history.locator('li').last().getByRole('button', { name: 'Restore as new' }).click();
    await expect.poll(() => stateOf(mine), { timeout: 30000 }).toBe('synced');
    await row(mine).getByRole('link', { name: shared.name }).click();
    await expect
      .poll(() => mine.getByLabel('Intensity λ (per year)').inputValue(), { timeout: 20000 })
      .toBe('0.35');
    await mine.getByRole('link', { name: 'Library' }).click();
    await row(mine).getByRole('button', { name: 'History' }).click();
    await expect
      .poll(() => mine.getByTestId('history').locator('li').count(), { timeout: 20000 })
      .toBe(3);
    expect(errors).toEqual([]);
    await leadContext.close();
    await traderContext.close();
  });
});
