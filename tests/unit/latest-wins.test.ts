/**
 * The smile channel to the engine worker: one request in the worker at a time, and a waiting
 * request whose caller gave up (its AbortSignal fired) never reaches the worker; the base surface
 * the worker keeps while only the stress changes is the one it would compute afresh.
 */
import { describe, expect, it } from 'vitest';
import { latestWins } from '../../src/workers/latest-wins';
import { computeSmiles } from '../../src/workers/engine-handlers';
import { smileSurface } from '../../src/engine/analytic';
import { DEFAULT_BATES, defaultMoneyness } from '../../src/engine/core';

describe('latest wins', () => {
  it('sends one request at a time and drops the waiting ones that were given up', async () => {
    const sent: number[] = [];
    const release: (() => void)[] = [];
    const send = (n: number) =>
      new Promise<number>((resolve) => {
        sent.push(n);
        release.push(() => resolve(n * 10));
      });
    const channel = latestWins(send);
    const first = channel(1);
    const second = new AbortController();
    const dropped = channel(2, second.signal);
    const third = channel(3);
    expect(sent).toEqual([1]); // the others wait
    second.abort(new Error('moved on'));
    await expect(dropped).rejects.toThrow('moved on');
    release[0]();
    expect(await first).toBe(10);
    await Promise.resolve();
    expect(sent).toEqual([1, 3]); // 2 never reached the worker
    release[1]();
    expect(await third).toBe(30);
    // a request given up before it is asked is refused at once
    const gone = new AbortController();
    gone.abort(new Error('already gone'));
    await expect(channel(4, gone.signal)).rejects.toThrow('already gone');
    expect(sent).toEqual([1, 3]);
  });
});

describe('the base surface kept while the stress changes', () => {
  it('is bit for bit the surface computed afresh, and follows a change of the model', () => {
    const market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
    const expiries = [1 / 365, 7 / 365, 0.25, 1];
    const moneyness = defaultMoneyness();
    const request = (stress: object, model = DEFAULT_BATES) => ({
      market,
      model,
      stress,
      expiries,
      moneyness,
    });
    const fresh = smileSurface(market, DEFAULT_BATES, expiries, moneyness);
    const a = computeSmiles(request({ jumpIntensityScale: 2 }));
    const b = computeSmiles(request({ jumpIntensityScale: 3 }));
    expect(JSON.stringify(a.base)).toBe(JSON.stringify(fresh));
    expect(JSON.stringify(b.base)).toBe(JSON.stringify(fresh));
    expect(JSON.stringify(b.stressed)).not.toBe(JSON.stringify(a.stressed));
    const other = { ...DEFAULT_BATES, jumpMean: -0.2 };
    const c = computeSmiles(request({ jumpIntensityScale: 3 }, other));
    expect(JSON.stringify(c.base)).toBe(
      JSON.stringify(smileSurface(market, other, expiries, moneyness)),
    );
  });
});
