import { describe, expect, it } from 'vitest';
import { appAndBrowser, trackErrors } from './harness';

const env = appAndBrowser();
const shots = process.env.SALTATION_SHOTS;

describe('Replay', () => {
  it('replays a two-leg position against a second hedge, saves it, and after a reload replays it to "matches"', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1500, height: 1100 } });
    const page = await context.newPage();
    const errors = trackErrors(page);
    await page.goto(env.app().url);
    await expect.poll(() => page.getByTestId('smile-chart').count(), { timeout: 20000 }).toBe(1);
    await page.getByRole('link', { name: 'Replay' }).click();

    // a bad leg is refused with its row named
    const strike = await page.getByLabel('Leg 2 strike').inputValue();
    await page.getByLabel('Leg 2 strike').fill('-5');
    await page.getByRole('button', { name: 'Replay hedge' }).click();
    await expect
      .poll(() => page.getByRole('alert').first().textContent())
      .toMatch(/^Leg 2: strike must be/);
    await page.getByLabel('Leg 2 strike').fill(strike);
    await page.getByLabel('Leg 1 days').fill('1000');
    await page.getByRole('button', { name: 'Replay hedge' }).click();
    await expect
      .poll(() => page.getByRole('alert').first().textContent())
      .toMatch(/^Leg 1: days must be above 0 and at most 2 years/);
    await page.getByLabel('Leg 1 days').fill('7');

    await page.getByLabel('Paths', { exact: true }).fill('4096');
    await page.getByRole('button', { name: 'Replay hedge' }).click();
    await expect.poll(() => page.getByTestId('replay-stats').count(), { timeout: 60000 }).toBe(1);
    // two hedges side by side, each with a digest
    const header = await page.getByTestId('replay-stats').locator('thead th').allTextContents();
    expect(header.slice(1)).toEqual([
      'model delta, 1× a day, 1 bp',
      'Black-Scholes delta, 1× a day, 1 bp',
    ]);
    const digests = await page
      .getByTestId('replay-stats')
      .locator('td.font-mono')
      .allTextContents();
    expect(digests).toHaveLength(2);
    expect(digests[0]).toMatch(/^[0-9a-f]{16}$/);
    await expect
      .poll(() => page.locator('[data-testid="path-drilldown"] .main-svg').count(), {
        timeout: 30000,
      })
      .toBeGreaterThan(0);
    if (shots) await page.screenshot({ path: `${shots}/replay-run.png`, fullPage: true });

    await page.getByRole('button', { name: 'Save run into the scenario' }).click();
    await expect.poll(() => page.getByText('Saved with its seed.').count()).toBe(1);

    await page.reload();
    await expect.poll(() => page.getByTestId('saved-runs').locator('li').count()).toBe(1);
    // the form came back as it was left
    expect(await page.getByLabel('Paths', { exact: true }).inputValue()).toBe('4096');
    await page.getByRole('button', { name: 'Replay', exact: true }).click();
    const verdict = page.getByTestId('replay-check');
    await expect.poll(() => verdict.count(), { timeout: 60000 }).toBe(1);
    expect(await verdict.getAttribute('data-matches')).toBe('yes');
    expect(await verdict.textContent()).toContain('matches to the last bit');
    expect(await verdict.textContent()).toContain(digests[0]);
    if (shots) await page.screenshot({ path: `${shots}/replay-matches.png`, fullPage: true });
    expect(errors).toEqual([]);
    await context.close();
  });
});
