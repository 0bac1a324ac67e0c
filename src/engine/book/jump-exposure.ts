/**
 * A book's exposure to jumps, in a form that can be hedged:
 * - the P&L of an instant move of each ladder size with the delta part removed,
 *   V(S(1 + m)) − V(S) − Δ·S·m: what a delta-hedged book makes or loses on a gap of that size;
 * - the expected jump P&L per year, Λ(1)·E[V(S e^J) − V(S) − Δ·S(e^J − 1)], over the model's
 *   jump law (Gauss–Legendre panels over the log-jump density);
 * - the 1-day 99 % VaR and expected shortfall of the book revalued at the day's move, and the
 *   share of that expected shortfall that comes from days with at least one jump: the day's
 *   log-move is the mixture e^{−Λ}·(no jump) + (1 − e^{−Λ})·(at least one), both from COS.
 * P&L signs throughout: negative is a loss.
 */
import { modelSpec } from '../analytic/characteristic';
import { cosStrip, prepareCos } from '../analytic/cos';
import { forwardPrice } from '../core/market';
import { expectedJumps, NO_JUMPS, type JumpLaw, type ModelSpec } from '../core/model-spec';
import { logJumpDensity, logJumpRange } from './jump-law';
import { jumpSummary } from '../core/jump-summary';
import { legValuesAtMoves, legValuesAtMovesSticky, sumRow } from './book';
import type { Position } from './positions';
import type { Market, Model } from '../core/types';

export interface JumpExposure {
  moves: number[];
  /** per ladder move: the model's ladder P&L less Δ·S·m (Δ the book's model delta) */
  model: number[];
  /** the same under the vol-reaction rule's ladder */
  volReaction: number[];
  /** Λ(1)·E[P&L of one jump, delta part removed] under the model: negative is an expected loss */
  expectedJumpPnlPerYear: number;
  /** expected jumps over the next year, Λ(1) */
  jumpsPerYear: number;
  oneDay: {
    /** the 1st percentile of the 1-day P&L (revalued at the day's move, model held) */
    var99: number;
    /** the mean 1-day P&L beyond it */
    es99: number;
    /** the share of that expected shortfall from days with at least one jump (null without a loss) */
    jumpShare: number | null;
  };
}

/** 16-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun table 25.4). */
const GL_X = [
  0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438, 0.755404408355003,
  0.8656312023878318, 0.9445750230732326, 0.9894009349916499,
];
const GL_W = [
  0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165767,
  0.1246289712555339, 0.0951585116824928, 0.0622535239386479, 0.0271524594117541,
];

/** Nodes and weights (density included) for E[g(Y)] over the log-jump law. */
export function jumpQuadrature(jumps: JumpLaw): { y: number[]; w: number[] } {
  const range = logJumpRange(jumps);
  if (range === null) return { y: [], w: [] };
  if (range.point !== undefined) return { y: [range.point], w: [1] };
  const y: number[] = [];
  const w: number[] = [];
  // panels between the break points (a kink of the density sits on one)
  for (let s = 0; s + 1 < range.breaks.length; s++) {
    const lo = range.breaks[s];
    const hi = range.breaks[s + 1];
    const panels = range.panels;
    const h = (hi - lo) / panels;
    for (let p = 0; p < panels; p++) {
      const mid = lo + (p + 0.5) * h;
      for (let i = 0; i < GL_X.length; i++)
        for (const sign of [-1, 1]) {
          const x = mid + sign * GL_X[i] * 0.5 * h;
          y.push(x);
          w.push(GL_W[i] * 0.5 * h * logJumpDensity(jumps, x));
        }
    }
  }
  return { y, w };
}

export function jumpExposure(
  market: Market,
  model: Model,
  positions: readonly Position[],
  moves: readonly number[],
  bookDelta: number,
  ladders: { model: readonly number[]; volReaction: readonly number[] },
): JumpExposure {
  const S = market.spot;
  const spec = modelSpec(model);
  const deltaPart = (m: number) => bookDelta * S * m;
  const now = sumRow(legValuesAtMovesSticky(market, model, positions, [0])[0]);
  // Λ(1) E[g(J)], g the delta-hedged P&L of one jump revalued through the model
  const jumpsPerYear = expectedJumps(spec, 1);
  let expectedJumpPnlPerYear = 0;
  if (jumpsPerYear > 0) {
    const { y, w } = jumpQuadrature(spec.jumps);
    const jumpMoves = y.map((v) => Math.expm1(v));
    const values = legValuesAtMoves(market, model, positions, jumpMoves);
    let sum = 0;
    values.forEach((row, i) => (sum += w[i] * (sumRow(row) - now - deltaPart(jumpMoves[i]))));
    expectedJumpPnlPerYear = jumpsPerYear * sum;
  }
  return {
    moves: [...moves],
    model: ladders.model.map((p, i) => p - deltaPart(moves[i])),
    volReaction: ladders.volReaction.map((p, i) => p - deltaPart(moves[i])),
    expectedJumpPnlPerYear,
    jumpsPerYear,
    oneDay: oneDayTail(market, model, spec, positions, now),
  };
}

/**
 * Bins of the day's log-move: a fine grid over the diffusion's body, ±BODY_SDS of its standard
 * deviation, where a book's 1 % quantile usually falls, and a coarser one over the whole range
 * the jumps reach.
 */
const BODY_POINTS = 1201;
const RANGE_POINTS = 401;
const BODY_SDS = 10;

function dayEdges(a: number, b: number, centre: number, sd: number): Float64Array {
  const lo = Math.max(a, centre - BODY_SDS * sd);
  const hi = Math.min(b, centre + BODY_SDS * sd);
  const edges: number[] = [];
  for (let i = 0; i <= RANGE_POINTS; i++) {
    const e = a + ((b - a) * i) / RANGE_POINTS;
    if (e < lo || e > hi) edges.push(e);
  }
  for (let i = 0; i <= BODY_POINTS; i++) edges.push(lo + ((hi - lo) * i) / BODY_POINTS);
  return Float64Array.from(edges).sort();
}

function oneDayTail(
  market: Market,
  model: Model,
  spec: ModelSpec,
  positions: readonly Position[],
  now: number,
): JumpExposure['oneDay'] {
  const h = 1 / 365;
  const full = prepareCos(spec, h);
  const lambdaH = expectedJumps(spec, h);
  const p0 = Math.exp(-lambdaH);
  // without a jump, Y is the diffusion's, less the compensator Λ(h)·E[e^J − 1]
  const quiet: ModelSpec = { diffusion: spec.diffusion, jumps: NO_JUMPS, events: spec.events };
  const shift = lambdaH * (jumpSummary(spec.jumps)?.meanMove ?? 0);
  const noJump = prepareCos(quiet, h);
  const edges = dayEdges(full.a, full.b, -shift, Math.sqrt(noJump.variance));
  const n = edges.length - 1;
  const cdf = (prep: typeof full, ks: Float64Array) => {
    const out = new Float64Array(ks.length);
    const scratch = () => new Float64Array(ks.length);
    cosStrip(prep, ks, scratch(), scratch(), out, scratch());
    return out;
  };
  const cFull = cdf(full, edges);
  const cQuiet = cdf(
    noJump,
    Float64Array.from(edges, (e) => e + shift),
  );
  const growth = forwardPrice(market, h) / market.spot;
  const centres = Array.from(
    { length: n },
    (_, i) => growth * Math.exp(0.5 * (edges[i] + edges[i + 1])) - 1,
  );
  const pnl = legValuesAtMovesSticky(market, model, positions, centres).map(
    (row) => sumRow(row) - now,
  );
  const bins = centres.map((_, i) => ({
    pnl: pnl[i],
    all: Math.max(0, cFull[i + 1] - cFull[i]),
    quiet: p0 * Math.max(0, cQuiet[i + 1] - cQuiet[i]),
  }));
  bins.sort((a, b) => a.pnl - b.pnl);
  const total = bins.reduce((a, b) => a + b.all, 0);
  const tail = 0.01 * total;
  let mass = 0;
  let sum = 0;
  let quietSum = 0;
  for (const b of bins) {
    if (mass >= tail) break;
    const take = Math.min(b.all, tail - mass);
    if (take <= 0) continue;
    const part = take / (b.all || 1);
    mass += take;
    sum += take * b.pnl;
    quietSum += part * Math.min(b.quiet, b.all) * b.pnl;
  }
  const var99 = binQuantile(bins, tail);
  const es99 = mass > 0 ? sum / mass : 0;
  return {
    var99,
    es99,
    jumpShare: sum < 0 ? Math.min(1, Math.max(0, 1 - quietSum / sum)) : null,
  };
}

/**
 * The P&L at cumulative probability `level` over bins sorted by P&L, each bin's mass centred on
 * its P&L and the quantile drawn linearly between those centres, so that it moves smoothly with
 * the grid rather than by whole bins.
 */
function binQuantile(bins: readonly { pnl: number; all: number }[], level: number): number {
  let before = 0;
  let prev: { at: number; pnl: number } | null = null;
  for (const b of bins) {
    if (b.all <= 0) continue;
    const at = before + 0.5 * b.all;
    if (at >= level) {
      if (!prev) return b.pnl;
      return prev.pnl + ((b.pnl - prev.pnl) * (level - prev.at)) / (at - prev.at);
    }
    prev = { at, pnl: b.pnl };
    before += b.all;
  }
  return prev?.pnl ?? 0;
}
