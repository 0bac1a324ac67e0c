import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_DESK_BOOK, DEMO_USERS } from '../../server/demo';
import { appAndBrowser, signIn, trackErrors } from './harness';

const env = appAndBrowser();
const shots = process.env.SALTATION_SHOTS;
const [, trader, analyst] = DEMO_USERS;
const LEG = 'P4150-7d';

async function openDeskBook(page: Page) {
  await page.getByRole('link', { name: 'Book' }).click();
  const picker = page.getByLabel('Open book');
  await expect
    .poll(() => picker.locator(`option[value="desk:${DEMO_DESK_BOOK.id}"]`).count(), {
      timeout: 30000,
    })
    .toBe(1);
  await picker.selectOption(`desk:${DEMO_DESK_BOOK.id}`);
  await expect.poll(() => page.getByTestId('book-total').count(), { timeout: 30000 }).toBe(1);
}
const stateOf = (page: Page) =>
  page.getByTestId('desk-book-status').getByTestId('sync-state').getAttribute('data-state');
const quantity = (page: Page) => page.getByLabel(`Quantity of ${LEG}`);

describe('a book shared in a desk set, in the browser', () => {
  it('a trader edits a leg offline, it syncs when back online, and the analyst sees it read-only', async () => {
    const traderContext = await env
      .browser()
      .newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await signIn(env.app(), traderContext, trader);
    const errors = trackErrors(page);
    await openDeskBook(page);
    // the demo book: index options at 10 per contract, booked in euros, totalled per currency
    expect(await page.getByTestId('book-total').textContent()).toMatch(/^LKX 40 · EUR: value/);
    await expect.poll(() => stateOf(page), { timeout: 30000 }).toBe('synced');

    await traderContext.setOffline(true);
    await quantity(page).fill('-55');
    await quantity(page).blur();
    await expect.poll(() => stateOf(page), { timeout: 20000 }).toBe('pending');
    if (shots) await page.screenshot({ path: `${shots}/desk-book-offline.png`, fullPage: true });
    await traderContext.setOffline(false);
    await expect.poll(() => stateOf(page), { timeout: 30000 }).toBe('synced');
    expect(await page.getByTestId('desk-book-status').textContent()).toContain('revision 2');

    const analystContext = await env
      .browser()
      .newContext({ viewport: { width: 1400, height: 1000 } });
    const other = await signIn(env.app(), analystContext, analyst);
    const otherErrors = trackErrors(other);
    await openDeskBook(other);
    await expect.poll(() => quantity(other).inputValue(), { timeout: 30000 }).toBe('-55');
    expect(await other.getByTestId('desk-book-status').textContent()).toContain('Jonas Okafor');
    expect(await other.getByTestId('desk-book-status').textContent()).toContain(
      'You can read this book',
    );
    // read-only for an analyst: no upload, no removal, the quantity cannot be typed over
    expect(await other.getByTestId('positions-file').count()).toBe(0);
    expect(await other.getByRole('button', { name: `Remove ${LEG}` }).count()).toBe(0);
    expect(await quantity(other).getAttribute('readonly')).not.toBeNull();
    if (shots) await other.screenshot({ path: `${shots}/desk-book-analyst.png`, fullPage: true });
    expect(errors).toEqual([]);
    expect(otherErrors).toEqual([]);
    await traderContext.close();
    await analystContext.close();
  });
});
