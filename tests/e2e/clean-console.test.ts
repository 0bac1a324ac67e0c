/**
 * A page in normal use logs nothing to the console and fails no request: every page is visited
 * signed out, signed in (the demo desk's lead) and offline (after the app has been loaded once),
 * and the console errors, warnings and failed or refused requests are collected.
 */
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/demo';
import { appAndBrowser, signIn } from './harness';

const env = appAndBrowser();
const PAGES = [
  '/',
  '/book',
  '/fit',
  '/paths',
  '/replay',
  '/library',
  '/desk',
  '/account',
  '/signin',
];

/** Console errors and warnings, page errors, failed requests and answers of 400 and above. */
function watch(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('requestfailed', (r) => {
    // a request the test's own next navigation cut short is the browser's doing, not the app's
    if (r.failure()?.errorText !== 'net::ERR_ABORTED')
      problems.push(`failed: ${r.url()} ${r.failure()?.errorText}`);
  });
  page.on('response', (r) => {
    if (r.status() >= 400) problems.push(`${r.status()}: ${r.url()}`);
  });
  return problems;
}

/** Each page by its own address, settled (its first screen drawn, the service asked). */
async function visitAll(page: Page, base: string, problems: string[]) {
  for (const path of PAGES) {
    await page.goto(`${base}${path}`);
    await page.getByRole('navigation', { name: 'Pages' }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(problems, `visiting ${path}`).toEqual([]);
  }
}

describe('a clean console', () => {
  it('signed out, every page logs nothing and fails no request', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const problems = watch(page);
    await visitAll(page, env.app().url, problems);
    await context.close();
  });

  it('signed in, every page logs nothing and fails no request', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const lead = DEMO_USERS.find((u) => u.role === 'lead')!;
    const first = await signIn(env.app(), context, lead);
    await first.close();
    const page = await context.newPage();
    const problems = watch(page);
    await visitAll(page, env.app().url, problems);
    await context.close();
  });

  it('offline after one visit, every page logs nothing and fails no request', async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const problems = watch(page);
    // the service worker precaches the app on install and controls the page from the next load
    await page.goto(env.app().url);
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await page.reload();
    await expect
      .poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null))
      .toBe(true);
    await page.waitForLoadState('networkidle');
    await context.setOffline(true);
    for (const path of PAGES) {
      await page.goto(`${env.app().url}${path}`);
      await page.getByRole('navigation', { name: 'Pages' }).waitFor();
      await page.waitForLoadState('networkidle');
      expect(problems, `visiting ${path} offline`).toEqual([]);
    }
    await context.close();
  });
});
