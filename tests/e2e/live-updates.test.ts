import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { DEMO_SETS, DEMO_USERS } from '../../server/demo';
import { appAndBrowser, scenarioRow, signIn, syncStateOf, trackErrors } from './harness';

const env = appAndBrowser();
const [lead, trader] = DEMO_USERS;
const shared = DEMO_SETS[0].scenarios[1];

describe('live updates', () => {
  it("a colleague's edit pushed to the service makes the lead's page pull within 1.5 s, through the event stream (the poll is every 20 s), and the open Sketch shows it", async () => {
    const context = await env.browser().newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await signIn(env.app(), context, lead);
    const errors = trackErrors(page);
    const pulls: number[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/sync/pull')) pulls.push(Date.now());
    });
    await expect.poll(() => syncStateOf(page, shared.id), { timeout: 30000 }).toBe('synced');
    await scenarioRow(page, shared.id).getByRole('link', { name: shared.name }).click();
    const intensity = page.getByLabel('Intensity λ (per year)');
    await expect.poll(() => intensity.count(), { timeout: 20000 }).toBe(1);
    const before = await intensity.inputValue();
    // the stream is open (the status line says "live")
    await expect.poll(() => page.getByTestId('live-updates').count(), { timeout: 20000 }).toBe(1);

    // the trader, as a script on another machine would: sign in, read, push a new revision
    const api = `${env.app().url}/api`;
    const json = (r: Response) => r.json() as Promise<Record<string, unknown>>;
    const { token } = (await json(
      await fetch(`${api}/auth/signin`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: trader.email, password: trader.password }),
      }),
    )) as { token: string };
    const auth = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
    let pulled = (await json(await fetch(`${api}/sync/pull?since=0`, { headers: auth }))) as {
      changes: {
        scenarioId: string;
        setId: string;
        revision: number;
        document: { model: object };
      }[];
      cursor: string;
      more: boolean;
    };
    const all = [...pulled.changes];
    while (pulled.more) {
      pulled = (await json(
        await fetch(`${api}/sync/pull?since=${pulled.cursor}`, { headers: auth }),
      )) as typeof pulled;
      all.push(...pulled.changes);
    }
    const current = all.filter((c) => c.scenarioId === shared.id).at(-1)!;
    const next = before === '0.64' ? 0.66 : 0.64;
    const pushed = Date.now();
    const push = (await json(
      await fetch(`${api}/sync/push`, {
        method: 'POST',
        headers: auth,
        body: JSON.stringify({
          mutations: [
            {
              mutationId: randomUUID(),
              scenarioId: shared.id,
              setId: current.setId,
              baseRevision: current.revision,
              document: {
                ...current.document,
                model: { ...current.document.model, jumpIntensity: next },
              },
            },
          ],
        }),
      }),
    )) as { results: { status: string }[] };
    expect(push.results[0].status).toBe('applied');
    // the page asks at once (the event), not at its next 20-second poll
    await expect
      .poll(() => pulls.filter((t) => t >= pushed).length, { timeout: 1500, interval: 50 })
      .toBeGreaterThan(0);
    // and the open Sketch follows (its charts take their time on a busy machine)
    await expect
      .poll(() => intensity.inputValue(), { timeout: 15000, interval: 100 })
      .toBe(String(next));
    expect(errors).toEqual([]);
    await context.close();
  });
});
