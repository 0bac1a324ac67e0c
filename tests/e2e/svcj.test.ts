import { describe, expect, it } from 'vitest';
import { appAndBrowser, openSketch } from './harness';

const env = appAndBrowser();

describe('an SVCJ scenario', () => {
  it('is made on Sketch with its jump law in plain words, kept after a reload, and its gap ladder draws the rule lines', async () => {
    const { context, page, errors } = await openSketch(env);
    const kind = page.locator('select').filter({ hasText: 'SVCJ' });
    await kind.selectOption('svcj');
    const note = page.getByTestId('jump-law-note');
    await expect.poll(() => note.textContent(), { timeout: 10000 }).toContain('Each jump adds');
    expect(await note.textContent()).toMatch(/A jump every [\d.]+ years on average/);
    await expect.poll(() => page.getByTestId('stress-varianceJumpScale').count()).toBe(1);
    await expect
      .poll(() => page.getByTestId('save-state').getAttribute('data-state'), { timeout: 10000 })
      .toBe('saved');

    await page.reload();
    await expect
      .poll(() => page.locator('select').filter({ hasText: 'SVCJ' }).inputValue(), {
        timeout: 20000,
      })
      .toBe('svcj');
    await expect.poll(() => page.getByLabel('Mean variance jump μV').count()).toBe(1);

    // the demo book revalues under this scenario: the model line says the variance reacts
    await page.getByRole('link', { name: 'Book' }).click();
    const legend = page.getByTestId('gap-ladder').locator('.legendtext');
    await expect.poll(() => legend.count(), { timeout: 30000 }).toBeGreaterThan(3);
    const names = await legend.allTextContents();
    expect(names).toContain('base model: variance jumps with the move');
    expect(names).toContain('sticky strike (each option keeps its vol)');
    expect(names.some((n) => n.startsWith('sticky strike, ATM vol +0.5 pts per 1 % fall'))).toBe(
      true,
    );
    expect(names).toContain('sticky moneyness (variance held)');
    expect(errors).toEqual([]);
    await context.close();
  });
});
