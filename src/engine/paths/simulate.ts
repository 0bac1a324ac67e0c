/**
 * Monte Carlo of the scenario's model. Variance by Andersen's QE scheme with his martingale
 * correction (Andersen 2008, "Simple and efficient simulation of the Heston stochastic volatility
 * model", J. Comp. Finance 11(3), sections 3.2.4 and 7.2; γ1 = γ2 = ½, ψc = 1.5), or by
 * full-truncation Euler (Lord, Koekkoek & van Dijk 2010) for comparison; constant variance is
 * stepped exactly. Jumps are compound Poisson with the compensated drift −λk̄Δ. Paths run in
 * fixed blocks, each with its own generator from (seed, block), and block sums are added in block
 * order, so the numbers do not depend on how many workers ran the blocks.
 */
import { modelSpec } from '../analytic/characteristic';
import { discountFactor, dividendRate, riskFreeRate } from '../core/market';
import { histogramInto, type HistogramSpec } from './histogram';
import { diffusionStep, drawMove, jumpSampler, meanRelativeJump } from './path-step';
import { settlementStep, stepGrid, type StepGrid } from './step-grid';
import type { ModelSpec } from '../core/model-spec';
import { BlockRandom } from './random';
import type { Market, Model, OptionSpec } from '../core/types';

export const BLOCK_PATHS = 2048;

export interface SimulationSettings {
  horizon: number;
  stepsPerYear: number;
  paths: number;
  seed: number;
  antithetic: boolean;
  scheme: 'qe' | 'euler';
  options: OptionSpec[];
  /** block 0 keeps spot and variance at this many evenly spaced times, for fans and sample paths */
  recordTimes?: number;
  /** bins for a histogram of ln(S_T/S_0) over all paths */
  histogram?: HistogramSpec;
}

/** What block 0 records: per path, spot and variance at `times`, and the path's jump count. */
export interface PathRecord {
  times: Float64Array;
  /** [path × time], spot */
  spot: Float32Array;
  /** [path × time], variance */
  variance: Float32Array;
  jumpCounts: Uint16Array;
  /** the log-size of each step's jumps (at most 50,000 kept) */
  jumpSizes: Float32Array;
  jumpSizeCount: number;
}

/** Sums one block contributes; blocks are combined by adding these in block order. */
export interface BlockSums {
  /** per option: Σ discounted payoff, Σ payoff² */
  payoff: Float64Array;
  payoffSq: Float64Array;
  /** per option: Σ of squared antithetic pair averages (for standard errors) */
  pairSq: Float64Array;
  /**
   * Control variate (the discounted spot at the option's expiry, whose mean is known): per option,
   * sums over units (antithetic pairs, or paths) of x, y, x², y², xy, with x the payoff.
   */
  cv: Float64Array;
  units: number;
  count: number;
  /** Σ S_T/S_0 and Σ (S_T/S_0)² */
  terminalSum: number;
  terminalSq: number;
  /** Σ v_T and Σ v_T² (the variance at the horizon) */
  varianceSum: number;
  varianceSq: number;
  jumps: number;
  /** terminal log-returns ln(S_T/S_0), for quantiles and the histogram */
  terminal: Float64Array;
  record?: PathRecord;
  histogram?: Uint32Array;
  /** the grid's step count, and per option the time of the boundary where it settles */
  steps: number;
  settleTimes: Float64Array;
}

export function stepCount(s: Pick<SimulationSettings, 'horizon' | 'stepsPerYear'>): number {
  return Math.max(1, Math.round(s.horizon * s.stepsPerYear));
}

/** The simulation's time grid: even steps, with scheduled moves' dates as boundaries. */
export function simulationGrid(
  market: Market,
  spec: ModelSpec,
  s: Pick<SimulationSettings, 'horizon' | 'stepsPerYear'>,
): StepGrid {
  const carry = riskFreeRate(market, s.horizon) - dividendRate(market, s.horizon);
  return stepGrid(spec, s.horizon, stepCount(s), carry, meanRelativeJump(spec.jumps));
}

type Advance = ReturnType<typeof diffusionStep>;

/** One diffusion step per distinct (Δt, drift), shared by the steps that have them. */
export function stepAdvances(spec: ModelSpec, scheme: 'qe' | 'euler', grid: StepGrid): Advance[] {
  const made = new Map<string, Advance>();
  return Array.from(grid.dt, (dt, k) => {
    const key = `${dt}|${grid.drift[k]}`;
    let f = made.get(key);
    if (!f) made.set(key, (f = diffusionStep(spec, scheme, dt, grid.drift[k])));
    return f;
  });
}

/** Runs one block of paths and returns its sums. */
export function simulateBlock(
  market: Market,
  model: Model,
  s: SimulationSettings,
  block: number,
): BlockSums {
  const spec = modelSpec(model);
  const grid = simulationGrid(market, spec, s);
  const n = grid.steps;
  const first = block * BLOCK_PATHS;
  const count = Math.min(BLOCK_PATHS, s.paths - first);
  const rng = new BlockRandom(s.seed, block);
  const jumpStep = jumpSampler(spec.jumps);
  const varianceJumps = spec.jumps.type === 'price-variance';
  const lam = grid.expectedJumps;
  const p0 = lam.map((l) => Math.exp(-l));
  const moves = grid.movesAt;
  const optionSteps = s.options.map((o) => settlementStep(grid, o.expiry));
  const discounts = s.options.map((_, i) => discountFactor(market, grid.times[optionSteps[i]]));
  const sums: BlockSums = {
    payoff: new Float64Array(s.options.length),
    payoffSq: new Float64Array(s.options.length),
    pairSq: new Float64Array(s.options.length),
    cv: new Float64Array(5 * s.options.length),
    units: 0,
    count,
    terminalSum: 0,
    terminalSq: 0,
    varianceSum: 0,
    varianceSq: 0,
    jumps: 0,
    terminal: new Float64Array(count),
    steps: n,
    settleTimes: Float64Array.from(optionSteps, (k) => grid.times[k]),
  };
  const d = spec.diffusion;
  const heston = d.type === 'heston';
  const advances = stepAdvances(spec, s.scheme, grid);
  const state = new Float64Array(2);
  const values = new Float64Array(s.options.length);
  const previous = new Float64Array(s.options.length);
  const controls = new Float64Array(s.options.length);
  const previousControls = new Float64Array(s.options.length);
  const obsStep =
    block === 0 && s.recordTimes ? recordSteps(grid, s.recordTimes) : new Int32Array(0);
  const obs = obsStep.length;
  if (obs > 0) {
    sums.record = {
      times: Float64Array.from(obsStep, (st) => grid.times[st]),
      spot: new Float32Array(count * obs),
      variance: new Float32Array(count * obs),
      jumpCounts: new Uint16Array(count),
      jumpSizes: new Float32Array(50000),
      jumpSizeCount: 0,
    };
  }
  const rec = sums.record;
  if (s.histogram) sums.histogram = new Uint32Array(s.histogram.bins);
  const pairZ = new Float64Array(2 * n);
  const pairU = new Float64Array(n);
  for (let p = 0; p < count; p++) {
    const mirror = s.antithetic && p % 2 === 1;
    let x = 0; // ln(S/S0)
    let v = heston ? d.v0 : d.variance;
    let oi = 0;
    let ri = 0;
    let pathJumps = 0;
    for (let step = 1; step <= n; step++) {
      let z1: number, z2: number, u: number;
      if (mirror) {
        z1 = -pairZ[2 * step - 2];
        z2 = -pairZ[2 * step - 1];
        u = 1 - pairU[step - 1];
      } else {
        z1 = rng.normal();
        z2 = rng.normal();
        u = rng.uniform();
        if (s.antithetic) {
          pairZ[2 * step - 2] = z1;
          pairZ[2 * step - 1] = z2;
          pairU[step - 1] = u;
        }
      }
      // a scheduled move dated t_{step−1} lands at the start of this step
      for (const e of moves[step - 1]) x += drawMove(e, rng);
      state[0] = x;
      state[1] = v;
      advances[step - 1](state, z1, z2, u);
      x = state[0];
      v = state[1];
      if (jumpStep) {
        const j = jumpStep(rng, lam[step - 1], p0[step - 1]);
        if (varianceJumps) v += jumpStep.varianceJump;
        if (j !== 0) {
          sums.jumps++;
          pathJumps++;
          if (rec && rec.jumpSizeCount < rec.jumpSizes.length)
            rec.jumpSizes[rec.jumpSizeCount++] = j;
        }
        x += j;
      }
      if (rec && ri < obs && obsStep[ri] === step) {
        rec.spot[p * obs + ri] = market.spot * Math.exp(x);
        rec.variance[p * obs + ri] = v;
        ri++;
      }
      while (oi < optionSteps.length && optionSteps[oi] === step) {
        const o = s.options[oi];
        const S = market.spot * Math.exp(x);
        values[oi] = discounts[oi] * Math.max(0, o.type === 'call' ? S - o.strike : o.strike - S);
        controls[oi] = discounts[oi] * S;
        oi++;
      }
    }
    const unitDone = !s.antithetic || mirror;
    if (unitDone) sums.units++;
    for (let i = 0; i < values.length; i++) {
      sums.payoff[i] += values[i];
      sums.payoffSq[i] += values[i] * values[i];
      if (mirror) {
        const pair = 0.5 * (values[i] + previous[i]);
        sums.pairSq[i] += pair * pair;
      }
      if (unitDone) {
        const ux = mirror ? 0.5 * (values[i] + previous[i]) : values[i];
        const uy = mirror ? 0.5 * (controls[i] + previousControls[i]) : controls[i];
        const c = sums.cv;
        c[5 * i] += ux;
        c[5 * i + 1] += uy;
        c[5 * i + 2] += ux * ux;
        c[5 * i + 3] += uy * uy;
        c[5 * i + 4] += ux * uy;
      }
      previous[i] = values[i];
      previousControls[i] = controls[i];
    }
    if (rec) rec.jumpCounts[p] = Math.min(65535, pathJumps);
    const level = Math.exp(x);
    sums.terminalSum += level;
    sums.terminalSq += level * level;
    sums.varianceSum += v;
    sums.varianceSq += v * v;
    sums.terminal[p] = x;
    if (sums.histogram) histogramInto(sums.histogram, s.histogram!, x);
  }
  return sums;
}

/**
 * The steps at which block 0 records its paths: `count` evenly spaced ones, plus each scheduled
 * move's boundary and the step after it, so that a fan shows the move as a step.
 */
function recordSteps(grid: StepGrid, count: number): Int32Array {
  const n = grid.steps;
  const obs = Math.min(count, n);
  const steps = Array.from({ length: obs }, (_, i) => Math.round(((i + 1) * n) / obs));
  if (!grid.even) {
    grid.movesAt.forEach((m, k) => {
      if (m.length > 0 && k > 0) steps.push(k, Math.min(n, k + 1));
    });
  }
  return Int32Array.from(new Set(steps)).sort();
}

export interface SimulationResult {
  seed: number;
  paths: number;
  steps: number;
  /** plain estimates, and with the discounted spot as control variate */
  estimates: {
    price: number;
    stdError: number;
    priceControlled: number;
    stdErrorControlled: number;
  }[];
  /** S_T: mean with its standard error (the martingale check: mean ≈ forward), stdev, quantiles */
  terminal: {
    mean: number;
    meanStdError: number;
    stdev: number;
    quantiles: Record<string, number>;
  };
  jumpsPerPath: number;
  /** the variance at the horizon: mean and its standard error */
  terminalVariance: { mean: number; stdError: number };
  elapsedMs: number;
}

/** Adds block sums in block order and turns them into estimates. */
export function combineBlocks(
  market: Market,
  s: SimulationSettings,
  blocks: readonly BlockSums[],
  elapsedMs: number,
): SimulationResult {
  const k = s.options.length;
  const payoff = new Float64Array(k);
  const payoffSq = new Float64Array(k);
  const pairSq = new Float64Array(k);
  const cv = new Float64Array(5 * k);
  let units = 0;
  let n = 0;
  let tSum = 0;
  let tSq = 0;
  let vSum = 0;
  let vSq = 0;
  let jumps = 0;
  for (const b of blocks) {
    for (let i = 0; i < k; i++) {
      payoff[i] += b.payoff[i];
      payoffSq[i] += b.payoffSq[i];
      pairSq[i] += b.pairSq[i];
    }
    for (let j = 0; j < 5 * k; j++) cv[j] += b.cv[j];
    units += b.units;
    n += b.count;
    tSum += b.terminalSum;
    tSq += b.terminalSq;
    vSum += b.varianceSum;
    vSq += b.varianceSq;
    jumps += b.jumps;
  }
  const horizonCarry = riskFreeRate(market, s.horizon) - dividendRate(market, s.horizon);
  const first = blocks[0];
  const estimates = Array.from({ length: k }, (_, i) => {
    const mean = payoff[i] / n;
    let stdError: number;
    if (s.antithetic) {
      const pairs = n / 2;
      const pairVar = pairSq[i] / pairs - mean * mean;
      stdError = Math.sqrt(Math.max(0, pairVar) / Math.max(1, pairs - 1));
    } else {
      const variance = payoffSq[i] / n - mean * mean;
      stdError = Math.sqrt(Math.max(0, variance) / Math.max(1, n - 1));
    }
    // control variate: y = DF(t)·S_t, E[y] = DF(t)·S_0·e^{(r − q)t} with the simulation's own carry
    const t = first.settleTimes[i];
    const ey = discountFactor(market, t) * market.spot * Math.exp(horizonCarry * t);
    const [sx, sy, sxx, syy, sxy] = [
      cv[5 * i],
      cv[5 * i + 1],
      cv[5 * i + 2],
      cv[5 * i + 3],
      cv[5 * i + 4],
    ];
    const mx = sx / units;
    const my = sy / units;
    const vxx = sxx / units - mx * mx;
    const vyy = syy / units - my * my;
    const vxy = sxy / units - mx * my;
    const beta = vyy > 0 ? vxy / vyy : 0;
    const priceControlled = mx - beta * (my - ey);
    const resid = Math.max(0, vxx - beta * vxy);
    return {
      price: mean,
      stdError,
      priceControlled,
      stdErrorControlled: Math.sqrt(resid / Math.max(1, units - 1)),
    };
  });
  // quantiles from the first blocks' terminal values (deterministic for any worker count)
  const sample: number[] = [];
  for (const b of blocks) {
    for (const x of b.terminal) sample.push(x);
    if (sample.length >= 65536) break;
  }
  sample.sort((a, b) => a - b);
  const q = (p: number) =>
    market.spot * Math.exp(sample[Math.min(sample.length - 1, Math.floor(p * sample.length))]);
  const meanLevel = tSum / n;
  const sdLevel = Math.sqrt(Math.max(0, tSq / n - meanLevel * meanLevel));
  return {
    seed: s.seed,
    paths: n,
    steps: first.steps,
    estimates,
    terminal: {
      mean: market.spot * meanLevel,
      meanStdError: (market.spot * sdLevel) / Math.sqrt(Math.max(1, n - 1)),
      stdev: market.spot * sdLevel,
      quantiles: {
        p01: q(0.01),
        p05: q(0.05),
        p25: q(0.25),
        p50: q(0.5),
        p75: q(0.75),
        p95: q(0.95),
        p99: q(0.99),
      },
    },
    jumpsPerPath: jumps / n,
    terminalVariance: {
      mean: vSum / n,
      stdError: Math.sqrt(Math.max(0, vSq / n - (vSum / n) ** 2) / Math.max(1, n - 1)),
    },
    elapsedMs,
  };
}

export function blockCount(s: Pick<SimulationSettings, 'paths'>): number {
  return Math.ceil(s.paths / BLOCK_PATHS);
}

/** The whole simulation in this thread (CLI, tests); workers run blocks and combine the same way. */
export function simulate(
  market: Market,
  model: Model,
  settings: SimulationSettings,
): SimulationResult {
  const started = performance.now();
  const order = settings.options.map((o, i) => ({ o, i })).sort((a, b) => a.o.expiry - b.o.expiry);
  const sorted = { ...settings, options: order.map((x) => x.o) };
  const blocks: BlockSums[] = [];
  for (let b = 0; b < blockCount(settings); b++)
    blocks.push(simulateBlock(market, model, sorted, b));
  const r = combineBlocks(market, sorted, blocks, performance.now() - started);
  const estimates = new Array(order.length);
  order.forEach((x, j) => (estimates[x.i] = r.estimates[j]));
  return { ...r, estimates };
}
