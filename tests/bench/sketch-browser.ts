/**
 * Benchmark: Sketch in headless Chromium, as a trader drags the stress sliders of the demo index
 * (Bates). Each slider moves 20 steps by single key presses (waiting for each new state to be
 * drawn) and then 20 steps as a fast drag (presses without waiting). Measured from each input
 * event to the page's User Timing mark `sketch:painted` (set once the frame showing the new smile
 * panels is painted): p50 and p95; the main thread's busy time per step (Chromium's own
 * TaskDuration metric, through the DevTools protocol); the engine time per smile request; and,
 * after a drag, whether the last frame shows the final position. A single press's main-thread
 * time is counted to its painted frame and, separately, with the side views (term structure,
 * density, tables) that follow once the step has settled. The app is served from `dist/`
 * with the sync service answering 503, as on a laptop without a connection. The peer is a step
 * that changes nothing on the page (a key press on a slider already at its end).
 */
import express from 'express';
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import type { Server } from 'node:http';
import { fileURLToPath } from 'node:url';
import { chromium, type Page } from 'playwright-core';
import { freePort } from '../../server/bootstrap/postgres';
import { CHROMIUM_ARGS, ensureChromium } from '../e2e/chromium';
import { fmt } from './timing';

const root = fileURLToPath(new URL('../..', import.meta.url));
const dist = `${root}dist`;
const STEPS = 20;
const SLIDERS = [
  'jumpIntensityScale',
  'jumpMeanShift',
  'jumpStdevScale',
  'volOfVolScale',
  'v0Scale',
  'spotShift',
];

interface Paint {
  t: number;
  engineMs: number;
  stress: string;
}

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))] : NaN;
};

async function serveDist(): Promise<{ url: string; close: () => Promise<void> }> {
  // built afresh: a `dist/` left from older code would be measured in its place
  const r = spawnSync('npx', ['vite', 'build'], { cwd: root, stdio: 'ignore' });
  if (r.status !== 0 || !existsSync(`${dist}/index.html`)) throw new Error('vite build failed');
  const app = express();
  app.use('/api', (_req, res) => void res.status(503).json({ error: 'offline' }));
  app.use(express.static(dist));
  app.use((_req, res) => res.sendFile(`${dist}/index.html`));
  const port = await freePort();
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  return {
    url: `http://127.0.0.1:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Collects key-down times and painted marks inside the page. */
async function instrument(page: Page) {
  await page.evaluate(() => {
    const w = window as unknown as {
      bench: { inputs: number[]; paints: Paint[]; waiters: (() => void)[] };
    };
    w.bench = { inputs: [], paints: [], waiters: [] };
    document.addEventListener('keydown', (e) => w.bench.inputs.push(e.timeStamp), true);
    new PerformanceObserver((list) => {
      for (const e of list.getEntries())
        if (e.name === 'sketch:painted')
          w.bench.paints.push({ t: e.startTime, ...(e as PerformanceMark).detail });
      // wake the harness once, rather than have it poll (its polling is main-thread work too)
      for (const wake of w.bench.waiters.splice(0)) wake();
    }).observe({ type: 'mark' });
  });
}

const state = (page: Page) =>
  page.evaluate(
    () => (window as unknown as { bench: { inputs: number[]; paints: Paint[] } }).bench,
  );

async function taskSeconds(cdp: import('playwright-core').CDPSession): Promise<number> {
  const { metrics } = await cdp.send('Performance.getMetrics');
  return metrics.find((m: { name: string }) => m.name === 'TaskDuration')?.value ?? 0;
}

/** Waits until no paint has come for `quiet` ms (or `limit` ms pass); answers the paints. */
async function settle(page: Page, quiet = 600, limit = 20000): Promise<Paint[]> {
  const start = Date.now();
  let last = -1;
  let since = Date.now();
  for (;;) {
    const { paints } = await state(page);
    if (paints.length !== last) {
      last = paints.length;
      since = Date.now();
    }
    if (Date.now() - since > quiet || Date.now() - start > limit) return paints;
    await page.waitForTimeout(50);
  }
}

export async function benchSketchBrowser(): Promise<Record<string, string>[]> {
  const site = await serveDist();
  const browser = await chromium.launch({
    executablePath: ensureChromium(() => undefined),
    args: CHROMIUM_ARGS,
  });
  try {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await page.goto(site.url);
    await page.getByTestId('smile-chart').waitFor({ timeout: 60000 });
    await instrument(page);
    await settle(page, 1500);
    const cdp = await context.newCDPSession(page);
    await cdp.send('Performance.enable');

    const single: number[] = [];
    const engine: number[] = [];
    const busy: number[] = [];
    // main thread from the press to its painted frame (the step's own work)
    const own: number[] = [];
    const dragFinal: number[] = [];
    const dragBusy: number[] = [];
    let dragExact = 0;
    for (const key of SLIDERS) {
      const slider = page.getByTestId(`stress-${key}`);
      if ((await slider.count()) === 0) continue;
      await slider.focus();
      // single presses, each waited for
      const before = await taskSeconds(cdp);
      for (let i = 0; i < STEPS; i++) {
        const seen = (await state(page)).paints.length;
        const start = await taskSeconds(cdp);
        // a string, so the bundler adds no helpers the page lacks
        const painted = page.evaluate(`new Promise((resolve, reject) => {
          const b = window.bench;
          const timer = setTimeout(() => reject(new Error('no paint within 20 s')), 20000);
          const wake = () => {
            if (b.paints.length > ${seen}) {
              clearTimeout(timer);
              resolve();
            } else b.waiters.push(wake);
          };
          wake();
        })`);
        await page.keyboard.press('ArrowRight');
        await painted;
        own.push(1000 * ((await taskSeconds(cdp)) - start));
        const { inputs, paints } = await state(page);
        single.push(paints[paints.length - 1].t - inputs[inputs.length - 1]);
        engine.push(paints[paints.length - 1].engineMs);
        // the side views follow once the step has settled: wait for them before the next press
        await page.waitForTimeout(350);
      }
      await settle(page);
      busy.push((1000 * ((await taskSeconds(cdp)) - before)) / STEPS);
      // a fast drag back: presses without waiting
      const dragStart = await taskSeconds(cdp);
      for (let i = 0; i < STEPS; i++) await page.keyboard.press('ArrowLeft', { delay: 0 });
      const paints = await settle(page);
      dragBusy.push((1000 * ((await taskSeconds(cdp)) - dragStart)) / STEPS);
      const { inputs } = await state(page);
      const last = paints[paints.length - 1];
      dragFinal.push(last.t - inputs[inputs.length - 1]);
      const finalValue = Number(await slider.inputValue());
      const drawn = JSON.parse(last.stress) as Record<string, number> | null;
      if (drawn && Math.abs((drawn[key] ?? NaN) - finalValue) < 1e-12) dragExact++;
    }
    // peer: a press that changes nothing (the slider is at its lower end after the drag back
    // for scale sliders: press Home first)
    const peerSlider = page.getByTestId('stress-jumpIntensityScale');
    await peerSlider.focus();
    await page.keyboard.press('Home');
    await settle(page);
    const idleStart = await taskSeconds(cdp);
    for (let i = 0; i < STEPS; i++) {
      await page.keyboard.press('ArrowLeft');
      await page.waitForTimeout(30);
    }
    const idle = (1000 * ((await taskSeconds(cdp)) - idleStart)) / STEPS;
    const sliders = busy.length;
    return [
      {
        case: `single presses, ${sliders} sliders × ${STEPS}`,
        'input to painted p50 ms': fmt(quantile(single, 0.5), 3),
        'p95 ms (target ≤ 50)': fmt(quantile(single, 0.95), 3),
        'main thread ms per step (target ≤ 16)': `${fmt(quantile(own, 0.5), 3)} to the frame (p95 ${fmt(quantile(own, 0.95), 3)}); ${fmt(quantile(busy, 0.5), 3)} with the side views that follow`,
        'engine ms per request p50 / p95': `${fmt(quantile(engine, 0.5), 3)} / ${fmt(quantile(engine, 0.95), 3)}`,
        'peer: a press that changes nothing, main thread ms': fmt(idle, 2),
      },
      {
        case: `fast drag, ${sliders} sliders × ${STEPS} presses`,
        'input to painted p50 ms': `${fmt(quantile(dragFinal, 0.5), 3)} (last press to its frame)`,
        'p95 ms (target ≤ 50)': fmt(quantile(dragFinal, 0.95), 3),
        'main thread ms per step (target ≤ 16)': fmt(quantile(dragBusy, 0.5), 3),
        'engine ms per request p50 / p95': `final frame shows the final position: ${dragExact} of ${sliders}`,
        'peer: a press that changes nothing, main thread ms': fmt(idle, 2),
      },
    ];
  } finally {
    await browser.close();
    await site.close();
  }
}
