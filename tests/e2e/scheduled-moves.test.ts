import { describe, expect, it } from 'vitest';
import { appAndBrowser, openSketch } from './harness';

const env = appAndBrowser();

describe('Sketch with a scheduled move', () => {
  it('adds a dated move, shows its implied move and the expiries that straddle it, and keeps it after a reload', async () => {
    const { context, page, errors } = await openSketch(env);

    const panel = page.getByTestId('events-panel');
    await panel.scrollIntoViewIfNeeded();
    await panel.getByRole('button', { name: 'Add a move' }).click();
    await panel.getByLabel('Move 1 name').fill('Results');
    await panel.getByLabel('Move s.d.').fill('5');

    // the ATM term structure brackets the move: the move it prices is the one entered
    const implied = page.getByTestId('implied-move');
    // the figure for the move as first added (3 %) may show until the 5 % term structure lands
    await expect
      .poll(async () => Math.abs(Number(await implied.textContent()) - 5), { timeout: 20000 })
      .toBeLessThan(0.3);
    const impliedMove = Number(await implied.textContent());
    // the grid expiries after the move say they include it; the 1W expiry, on the date, does not
    const straddling = page.getByTestId('straddling-expiries');
    await expect.poll(() => straddling.textContent()).toContain('2W includes Results (±5.0 %)');
    expect(await straddling.textContent()).not.toContain('1W includes');
    // the scheduled-move stress slider appears with the move
    await expect.poll(() => page.getByTestId('stress-eventSizeScale').count()).toBe(1);

    await expect
      .poll(() => page.getByTestId('save-state').getAttribute('data-state'), { timeout: 10000 })
      .toBe('saved');
    await page.reload();
    const rows = page.getByTestId('event-row');
    await expect.poll(() => rows.count(), { timeout: 20000 }).toBe(1);
    expect(await rows.first().getByLabel('Move 1 name').inputValue()).toBe('Results');
    expect(await rows.first().getByLabel('Move s.d.').inputValue()).toBe('5');
    await expect
      .poll(() => page.getByTestId('implied-move').textContent(), { timeout: 20000 })
      .toBe(String(impliedMove.toFixed(2)));
    expect(errors).toEqual([]);
    await context.close();
  });
});
