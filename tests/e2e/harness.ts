/** Browser-test harness: the real server on a free loopback port, and Debian's chromium. */
import type { Server } from 'node:http';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect } from 'vitest';
import { createApp } from '../../server/app';
import { freePort } from '../../server/bootstrap/postgres';
import { testDatabaseUrl, testDb } from '../support/database';
import { createLogger } from '../../server/logging';
import { ChangeEvents } from '../../server/sync/events';
import { testMail, type TestMail } from '../support/mail';
import { CHROMIUM_ARGS, ensureChromium } from './chromium';

const dist = fileURLToPath(new URL('../../dist', import.meta.url));

export interface RunningApp {
  url: string;
  mail: TestMail;
  close: () => Promise<void>;
}

export async function startApp(): Promise<RunningApp> {
  if (!existsSync(`${dist}/index.html`))
    throw new Error('Build the client first (npm test does): dist/ is missing');
  const db = testDb();
  const mail = await testMail();
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const logger = createLogger(() => undefined);
  // live updates as the real server runs them
  const events = await ChangeEvents.start(testDatabaseUrl(), db, logger);
  const app = createApp({
    db,
    jwtSecret: 'e2e-secret',
    staticDir: dist,
    logger,
    events,
    mailer: mail.mailer,
    appUrl: url,
  });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  return {
    url,
    mail,
    close: async () => {
      await events.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.destroy();
      await mail.close();
    },
  };
}

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: ensureChromium(() => undefined), args: CHROMIUM_ARGS });
}

/** Collects uncaught page errors so a test can assert there were none. */
export function trackErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return errors;
}

/** Starts the app and a browser before a file's tests and stops both after them. */
export function appAndBrowser(): { app: () => RunningApp; browser: () => Browser } {
  let app: RunningApp | undefined;
  let browser: Browser | undefined;
  beforeAll(async () => {
    app = await startApp();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await app?.close();
  });
  return { app: () => app!, browser: () => browser! };
}

/**
 * A fresh 1400 × 1000 tab on Sketch, once its smile panels have been drawn; with the page's
 * uncaught errors collected.
 */
export async function openSketch(env: ReturnType<typeof appAndBrowser>): Promise<{
  context: BrowserContext;
  page: Page;
  errors: string[];
}> {
  const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
  const page = await context.newPage();
  const errors = trackErrors(page);
  await page.goto(env.app().url);
  await expect
    .poll(() => page.locator('[data-testid="smile-canvas"][data-panels]').count(), {
      timeout: 20000,
    })
    .toBeGreaterThan(0);
  return { context, page, errors };
}

/** Signs in through the sign-in page in a fresh tab of the context; resolves on the Library. */
export async function signIn(
  app: RunningApp,
  context: BrowserContext,
  who: { email: string; password: string },
): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${app.url}/signin`);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/library');
  return page;
}

/** A scenario's row in the Library, and its sync state (the badge's data-state). */
export const scenarioRow = (page: Page, id: string) =>
  page.locator(`[data-testid="scenario-row"][data-id="${id}"]`);
export const syncStateOf = (page: Page, id: string) =>
  scenarioRow(page, id).getByTestId('sync-state').getAttribute('data-state');
