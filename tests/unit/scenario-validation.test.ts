import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { newScenario, parseScenario } from '../../src/engine/core';

const root = fileURLToPath(new URL('../..', import.meta.url));
const good = () =>
  newScenario('3b0f1c1e-7a0e-4a57-b0a8-2d0f4f1a9c11', 'Validation case', '2026-12-01');

function cli(command: string, input: string) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'cli/main.ts', command], {
    cwd: root,
    input,
    encoding: 'utf8',
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const BAD: [string, (d: Record<string, unknown>) => unknown, string][] = [
  ['missing market', (d) => ({ ...d, market: undefined }), 'market'],
  ['negative spot', (d) => ({ ...d, market: { spot: -5 } }), 'market.spot'],
  ['unknown model kind', (d) => ({ ...d, model: { kind: 'sabr', alpha: 0.2 } }), 'model.kind'],
  [
    'rho outside [−1, 1]',
    (d) => ({ ...d, model: { ...(d.model as object), rho: -1.2 } }),
    'model.rho',
  ],
  [
    'text where a number belongs',
    (d) => ({ ...d, model: { ...(d.model as object), jumpStdev: 'wide' } }),
    'model.jumpStdev',
  ],
  [
    'an expiry of zero',
    (d) => ({ ...d, grid: { ...(d.grid as object), expiries: [0] } }),
    'grid.expiries.0',
  ],
];

describe('the scenario validator', () => {
  it('accepts the default scenario and keeps unknown fields on a round trip', () => {
    const doc = {
      ...good(),
      deskTag: { colour: 'sand' },
      market: { ...good().market, venue: 'LKX' },
    };
    const r = parseScenario(JSON.parse(JSON.stringify(doc)));
    expect(r.ok).toBe(true);
    if (r.ok) expect(JSON.parse(JSON.stringify(r.value))).toEqual(JSON.parse(JSON.stringify(doc)));
  });

  for (const [what, mutate, path] of BAD) {
    it(`rejects ${what} with the path ${path}`, () => {
      const r = parseScenario(mutate(good() as unknown as Record<string, unknown>));
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.issues[0].path).toBe(path);
    });
  }
});

describe('the command line’s error contract', () => {
  for (const [what, mutate, path] of BAD) {
    it(`smile: ${what} exits 2 with {"error": {code, message, path: "${path}"}} and no stdout`, () => {
      const r = cli('smile', JSON.stringify(mutate(good() as unknown as Record<string, unknown>)));
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      const err = JSON.parse(r.stderr).error;
      expect(err).toMatchObject({ code: 'invalid-input', path });
      expect(err.message.length).toBeGreaterThan(5);
    });
  }

  it('non-JSON input exits 2 with code bad-json', () => {
    const r = cli('price', '{"market": ');
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(JSON.parse(r.stderr).error.code).toBe('bad-json');
  });

  it('price answers the Fang & Oosterlee Heston call with its implied vol and an elapsedMs', () => {
    const request = {
      market: { spot: 100, rate: 0, dividendYield: 0 },
      model: {
        kind: 'heston',
        kappa: 1.5768,
        theta: 0.0398,
        volOfVol: 0.5751,
        rho: -0.5711,
        v0: 0.0175,
      },
      options: [{ type: 'call', strike: 100, expiry: 1 }],
    };
    const r = cli('price', JSON.stringify(request));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    // Fang & Oosterlee 2008 Table 4 (high-precision value 5.7851554344)
    expect(Math.abs(out.results[0].price - 5.7851554344)).toBeLessThan(1e-9);
    expect(out.results[0].impliedVol).toBeGreaterThan(0.1);
    expect(typeof out.elapsedMs).toBe('number');
  });

  it('smile answers base and stressed surfaces for a stressed scenario', () => {
    const doc = { ...good(), stress: { jumpMeanShift: -0.05 } };
    const r = cli('smile', JSON.stringify(doc));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.impliedVols).toHaveLength(doc.grid.expiries.length);
    expect(out.stressed.rr25[0]).toBeLessThan(out.rr25[0]);
  });
});

describe('the revalue command', () => {
  const base = {
    market: { spot: 42, rate: 0.1 },
    model: { kind: 'black-scholes', sigma: 0.2 },
    positions: [
      { id: 'c', type: 'call', strike: 40, expiry: 0.5, quantity: 2 },
      { id: 'h', type: 'underlying', quantity: -1 },
    ],
    ladder: { from: -0.3, to: 0.1, steps: 5 },
  };

  it('answers legs, total and ladder (Hull call 4.7594 × 2 − 42)', () => {
    const r = cli('revalue', JSON.stringify(base));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.legs[0].value).toBeCloseTo(2 * 4.7594, 3);
    expect(out.total.value).toBeCloseTo(2 * 4.7594 - 42, 3);
    expect(out.ladder.map((l: { move: number }) => l.move)).toEqual([-0.3, -0.2, -0.1, 0, 0.1]);
    expect(out.ladder[3].pnl).toBe(0);
  });

  const bad: [string, unknown, string][] = [
    [
      'an option without an expiry',
      { ...base, positions: [{ id: 'x', type: 'put', strike: 40, quantity: 1 }] },
      'positions.0.expiry',
    ],
    [
      'a negative strike',
      { ...base, positions: [{ id: 'x', type: 'put', strike: -40, expiry: 1, quantity: 1 }] },
      'positions.0.strike',
    ],
    [
      'duplicate leg ids',
      { ...base, positions: [base.positions[0], base.positions[0]] },
      'positions.1.id',
    ],
    [
      'an unknown leg type',
      { ...base, positions: [{ id: 'x', type: 'future', quantity: 1 }] },
      'positions.0.type',
    ],
    [
      'a ladder running backwards',
      { ...base, ladder: { from: 0.1, to: -0.3, steps: 5 } },
      'ladder.to',
    ],
  ];
  for (const [what, request, path] of bad) {
    it(`refuses ${what} with exit 2 and path ${path}`, () => {
      const r = cli('revalue', JSON.stringify(request));
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(JSON.parse(r.stderr).error.path).toBe(path);
    });
  }
});

describe('the calibrate command', () => {
  it('fits Heston to quotes given as vols and as prices, answering the DESIGN fields', () => {
    const request = {
      market: { spot: 100 },
      model: { kind: 'heston', fixed: ['kappa'] },
      quotes: [
        { strike: 90, expiry: 0.5, impliedVol: 0.25 },
        { strike: 100, expiry: 0.5, impliedVol: 0.21 },
        { strike: 110, expiry: 0.5, impliedVol: 0.19 },
        { strike: 100, expiry: 1, type: 'call', price: 8.9 },
      ],
    };
    const r = cli('calibrate', JSON.stringify(request));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.model.kind).toBe('heston');
    expect(out.model.kappa).toBe(1.5);
    for (const key of ['sseVolPoints', 'rmseVolPoints', 'iterations', 'elapsedMs'])
      expect(typeof out[key]).toBe('number');
    expect(out.residuals).toHaveLength(4);
    expect(out.rmseVolPoints).toBeLessThan(0.01);
  });

  it('refuses a fixed name the model does not have, and a price outside the bounds', () => {
    const base = {
      market: { spot: 100 },
      model: { kind: 'heston' },
      quotes: [{ strike: 100, expiry: 0.5, impliedVol: 0.2 }],
    };
    const a = cli(
      'calibrate',
      JSON.stringify({ ...base, model: { kind: 'heston', fixed: ['jumpMean'] } }),
    );
    expect(a.status).toBe(2);
    expect(JSON.parse(a.stderr).error.path).toBe('model.fixed');
    const b = cli(
      'calibrate',
      JSON.stringify({ ...base, quotes: [{ strike: 100, expiry: 0.5, type: 'call', price: 150 }] }),
    );
    expect(b.status).toBe(2);
    expect(JSON.parse(b.stderr).error.path).toBe('quotes.0.price');
  });
});
