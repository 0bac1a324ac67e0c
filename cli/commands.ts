/** The CLI commands over the engine; each validates its request and times only engine work. */
import { z } from 'zod';
import {
  impliedEventMoves,
  priceOptions,
  impliedVol,
  smileSurface,
  surfaceGrids,
  type SmileSurface,
} from '../src/engine/analytic';
import { arbitrageFlags, calibrate as calibrateModel, completeGuess } from '../src/engine/fit';
import {
  parametersOf,
  discountFactor,
  forwardPrice,
  marketSchema,
  modelSchema,
  MAX_EXPIRY_YEARS,
  stressSchema,
  applyStress,
  isIdentityStress,
  parseScenario,
  MODEL_KINDS,
  type Market,
  type Model,
  type ModelKind,
  type OptionSpec,
} from '../src/engine/core';
import {
  bookTotal,
  DEFAULT_VOL_REACTION,
  jumpExposure,
  ladderMoves,
  legRisks,
  legValuesAtMoves,
  sumRow,
  volReactionValuesAtMoves,
  pnlSinceTrade,
  vegaByExpiry,
  ladderSchema,
  positionsSchema,
  inUnderlyingUnits,
  totalsByCurrency,
  type Position,
} from '../src/engine/book';
import { replay as replayHedge, replayRequestSchema } from '../src/engine/replay';
import { simulate as simulatePaths, simulationSettingsSchema } from '../src/engine/paths';
import { CliError, parse } from './io';
import { stressedInputs } from './stressed';

const optionSchema = z.object({
  type: z.enum(['call', 'put'], { error: 'must be "call" or "put"' }),
  strike: z.number().refine((x) => Number.isFinite(x) && x > 0, 'must be a positive number'),
  expiry: z
    .number()
    .refine(
      (x) => Number.isFinite(x) && x > 0 && x <= MAX_EXPIRY_YEARS,
      `must be above 0 and at most ${MAX_EXPIRY_YEARS} years`,
    ),
});

const priceRequest = z.object({
  market: marketSchema,
  model: modelSchema,
  options: z.array(optionSchema).min(1, 'needs at least one option').max(100000),
});

export function price(request: unknown) {
  const req = parse(priceRequest, request);
  const started = performance.now();
  const results = priceOptions(
    req.market as Market,
    req.model as Model,
    req.options as OptionSpec[],
  );
  const elapsedMs = performance.now() - started;
  return {
    results: results.map((r) => ({
      price: r.price,
      impliedVol: r.impliedVol,
      delta: r.delta,
      gamma: r.gamma,
      vega: r.vega,
      theta: r.theta,
      ...(r.note ? { note: r.note } : {}),
    })),
    elapsedMs,
  };
}

function surfaceJson(surface: SmileSurface) {
  return {
    expiries: surface.slices.map((s) => s.expiry),
    forwards: surface.slices.map((s) => s.forward),
    strikes: surface.slices.map((s) => s.strikes),
    impliedVols: surface.slices.map((s) => s.impliedVols),
    atm: surface.slices.map((s) => s.atm),
    rr25: surface.slices.map((s) => s.rr25),
    bf25: surface.slices.map((s) => s.bf25),
    rr10: surface.slices.map((s) => s.rr10),
    bf10: surface.slices.map((s) => s.bf10),
  };
}

export function smile(request: unknown) {
  const parsed = parseScenario(request);
  if (!parsed.ok) {
    const i = parsed.issues[0];
    throw new CliError('invalid-input', `${i.path}: ${i.message}`, i.path);
  }
  const doc = parsed.value;
  parse(stressSchema.optional(), doc.stress);
  const started = performance.now();
  const base = smileSurface(
    doc.market,
    doc.model,
    doc.grid.expiries,
    doc.grid.moneyness,
    doc.grid.strikeSpacing,
  );
  let stressed: SmileSurface | undefined;
  if (!isIdentityStress(doc.stress)) {
    const s = applyStress(doc.market, doc.model, doc.stress ?? {});
    if (s.issues.length > 0) {
      throw new CliError(
        'invalid-stress',
        `${s.issues[0].path}: ${s.issues[0].message}`,
        s.issues[0].path,
      );
    }
    stressed = smileSurface(s.market, s.model, doc.grid.expiries, surfaceGrids(base));
  }
  const events = doc.model.events ?? [];
  const { eventBaseVol } = parse(eventBaseVolSchema, doc);
  const eventMoves =
    events.length > 0
      ? impliedEventMoves(
          events.map((e) => e.time),
          base.slices.map((s) => s.expiry),
          base.slices.map((s) => s.atm),
          eventBaseVol,
        )
      : undefined;
  const elapsedMs = performance.now() - started;
  return {
    ...surfaceJson(base),
    ...(stressed ? { stressed: surfaceJson(stressed) } : {}),
    ...(eventMoves ? { eventMoves } : {}),
    elapsedMs,
  };
}

/** The base vol of the implied event moves; the ATM vol before each event when absent. */
const eventBaseVolSchema = z
  .object({
    eventBaseVol: z
      .number({ error: 'must be a number' })
      .refine((x) => Number.isFinite(x) && x > 0 && x < 5, 'must be above 0 and below 5')
      .optional(),
  })
  .loose();

const revalueRequest = z.object({
  market: marketSchema,
  model: modelSchema,
  stress: stressSchema.optional(),
  positions: positionsSchema,
  ladder: ladderSchema.optional(),
  /** the spot-vol reaction of the jump exposure: ATM vol points added per 1 % fall */
  volReaction: z
    .number({ error: 'must be a number' })
    .refine((x) => Number.isFinite(x) && Math.abs(x) <= 10, 'must be from −10 to 10')
    .optional(),
});

export function revalue(request: unknown) {
  const req = parse(revalueRequest, request);
  const { market, model } = stressedInputs(req);
  const booked = req.positions as Position[];
  const started = performance.now();
  // figures in units of the underlying: quantity × each leg's contract multiplier
  const positions = inUnderlyingUnits(booked);
  const legs = legRisks(market, model, positions);
  const total = bookTotal(legs);
  const moves = req.ladder ? ladderMoves(req.ladder) : [];
  const ladderPnl = legValuesAtMoves(market, model, positions, moves).map(
    (row) => sumRow(row) - total.value,
  );
  const ladder = ladderPnl.map((pnl, i) => ({ move: moves[i], pnl }));
  const reaction = req.volReaction ?? DEFAULT_VOL_REACTION;
  const exposure = req.ladder
    ? jumpExposure(market, model, positions, moves, total.delta, {
        model: ladderPnl,
        volReaction: volReactionValuesAtMoves(market, positions, legs, moves, reaction).map(
          (row) => sumRow(row) - total.value,
        ),
      })
    : null;
  const sinceTrade = pnlSinceTrade(positions, legs);
  const elapsedMs = performance.now() - started;
  return {
    legs: legs.map(({ id, value, delta, gamma, vega, theta }) => ({
      id,
      value,
      delta,
      gamma,
      vega,
      theta,
    })),
    total,
    // legs with a trade price: quantity × (price now − tradePrice)
    pnlSinceTrade: sinceTrade,
    // per currency of the legs (the market's when a leg names none), never added across
    totals: totalsByCurrency(market, booked, legs, sinceTrade.legs),
    vegaByExpiry: vegaByExpiry(positions, legs),
    ladder,
    // with a ladder: each move's P&L less the delta part, under the model and the vol-reaction rule
    ...(exposure
      ? {
          jumpExposure: {
            moves: exposure.moves.map((move, i) => ({
              move,
              model: exposure.model[i],
              volReaction: exposure.volReaction[i],
            })),
            volReaction: reaction,
            expectedJumpPnlPerYear: exposure.expectedJumpPnlPerYear,
            jumpsPerYear: exposure.jumpsPerYear,
            oneDay: exposure.oneDay,
          },
        }
      : {}),
    elapsedMs,
  };
}

const positive = z.number().refine((x) => Number.isFinite(x) && x > 0, 'must be a positive number');
const quoteSchema = z.union(
  [
    z.object({
      strike: positive,
      expiry: positive.refine((x) => x <= MAX_EXPIRY_YEARS, 'at most 50 years'),
      impliedVol: positive.refine((x) => x < 5, 'must be below 5 (500 %)'),
    }),
    z.object({
      strike: positive,
      expiry: positive.refine((x) => x <= MAX_EXPIRY_YEARS, 'at most 50 years'),
      type: z.enum(['call', 'put']),
      price: positive,
    }),
  ],
  { error: 'each quote needs strike, expiry and impliedVol, or strike, expiry, type and price' },
);

const calibrateRequest = z.object({
  market: marketSchema,
  model: z
    .object({
      kind: z.enum(MODEL_KINDS as [ModelKind, ...ModelKind[]], {
        error: 'must be a model kind',
      }),
      fixed: z.array(z.string()).optional(),
    })
    .loose(),
  quotes: z.array(quoteSchema).min(1, 'needs at least one quote').max(5000),
  weights: z.enum(['uniform', 'vega']).optional(),
  fitEventSizes: z
    .array(z.number().int('must be a whole number').min(0, 'must be 0 or more'))
    .max(50)
    .optional(),
});

export function calibrate(request: unknown) {
  const req = parse(calibrateRequest, request);
  const market = req.market as Market;
  const kind = req.model.kind;
  const fixed = req.model.fixed ?? [];
  const unknownFixed = fixed.find((f) => !(parametersOf(kind) as string[]).includes(f));
  if (unknownFixed)
    throw new CliError(
      'invalid-input',
      `model.fixed: "${unknownFixed}" is not a parameter of ${kind}`,
      'model.fixed',
    );
  const guess = completeGuess(kind, req.model);
  const eventCount = Array.isArray(req.model.events) ? req.model.events.length : 0;
  const badEvent = (req.fitEventSizes ?? []).findIndex((i) => i >= eventCount);
  if (badEvent >= 0)
    throw new CliError(
      'invalid-input',
      `fitEventSizes.${badEvent}: the model has no event ${req.fitEventSizes![badEvent]}`,
      `fitEventSizes.${badEvent}`,
    );
  const guessCheck = modelSchema.safeParse(guess);
  if (!guessCheck.success) {
    const i = guessCheck.error.issues[0];
    throw new CliError(
      'invalid-input',
      `model.${i.path.join('.')}: ${i.message}`,
      `model.${i.path.join('.')}`,
    );
  }
  const quotes = req.quotes.map((q, i) => {
    if ('impliedVol' in q) return { strike: q.strike, expiry: q.expiry, impliedVol: q.impliedVol };
    const iv = impliedVol({
      price: q.price,
      forward: forwardPrice(market, q.expiry),
      strike: q.strike,
      expiry: q.expiry,
      discount: discountFactor(market, q.expiry),
      isCall: q.type === 'call',
    });
    if (iv.vol === null)
      throw new CliError(
        'invalid-input',
        `quotes.${i}.price: outside the no-arbitrage bounds (${iv.failure})`,
        `quotes.${i}.price`,
      );
    return { strike: q.strike, expiry: q.expiry, impliedVol: iv.vol };
  });
  const r = calibrateModel({
    market,
    model: guess,
    fixed,
    fitEventSizes: req.fitEventSizes,
    quotes,
    weights: req.weights ?? 'uniform',
  });
  return {
    model: r.model,
    sseVolPoints: r.sseVolPoints,
    rmseVolPoints: r.rmseVolPoints,
    rmseByExpiry: r.rmseByExpiry,
    iterations: r.iterations,
    feller: r.feller,
    onBounds: r.onBounds,
    elapsedMs: r.elapsedMs,
    residuals: r.residuals,
    // static-arbitrage flags on the quotes as given (before the fit), at the market's forwards
    arbitrage: arbitrageFlags(
      quotes.map((q) => ({ ...q, forward: forwardPrice(market, q.expiry) })),
    ),
    standardErrors: Object.fromEntries(
      r.errors.names.map((n, i) => [n, r.errors.standardErrors[i]]),
    ),
    correlations: { names: r.errors.names, matrix: r.errors.correlations },
    notIdentified: r.errors.unidentified,
  };
}

const simulateRequest = z.object({ market: marketSchema, model: modelSchema }).loose();

export function simulate(request: unknown) {
  const req = parse(simulateRequest, request);
  const settings = parse(simulationSettingsSchema, request);
  const r = simulatePaths(req.market as Market, req.model as Model, {
    horizon: settings.horizon,
    stepsPerYear: settings.stepsPerYear,
    paths: settings.paths,
    seed: settings.seed,
    antithetic: settings.antithetic ?? true,
    scheme: settings.scheme ?? 'qe',
    options: settings.options ?? [],
  });
  return {
    seed: r.seed,
    paths: r.paths,
    steps: r.steps,
    estimates: r.estimates,
    terminal: r.terminal,
    jumpsPerPath: r.jumpsPerPath,
    elapsedMs: r.elapsedMs,
  };
}

export function replay(request: unknown) {
  const req = parse(replayRequestSchema, request);
  const r = replayHedge({
    market: req.market as Market,
    model: req.model as Model,
    position: req.position,
    ...(req.overlay?.length ? { overlay: req.overlay } : {}),
    hedge: req.hedge,
    paths: req.paths,
    seed: req.seed,
  });
  return {
    pnl: r.pnl,
    // P&L on steps with a scheduled move is its own part, present when the model has moves
    ...(req.model.events?.length
      ? {
          attribution: {
            diffusion: r.attribution.diffusion,
            jumps: r.attribution.jumps,
            events: r.attribution.events,
          },
          tail: {
            diffusion: r.attribution.tailDiffusion,
            jumps: r.attribution.tailJumps,
            events: r.attribution.tailEvents,
          },
        }
      : {
          attribution: { diffusion: r.attribution.diffusion, jumps: r.attribution.jumps },
          tail: { diffusion: r.attribution.tailDiffusion, jumps: r.attribution.tailJumps },
        }),
    worstPath: r.worstPath,
    digest: r.digest,
    premium: r.premium,
    ...(req.overlay?.length ? { overlayPremium: r.overlayPremium, overlayPnl: r.overlayPnl } : {}),
    steps: r.steps,
    elapsedMs: r.elapsedMs,
  };
}
