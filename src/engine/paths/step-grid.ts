/**
 * The time grid of a simulated path: n even steps over the horizon, with each scheduled move's
 * date made a step boundary so that the move lands exactly on it. A move at boundary k is
 * applied at the start of step k (after anything recorded at t_k), so an option expiring on the
 * move's date does not see it. Per step: its length, its expected jump count Λ(t_{k+1}) − Λ(t_k)
 * under the intensity schedule, and the drift (r − q)Δ − Λ_k·k̄. Without dated risk the grid is
 * the plain even one and every number is computed exactly as before it existed.
 */
import { expectedJumpsBetween, hasDatedRisk, type ModelSpec } from '../core/model-spec';
import type { ScheduledMove } from '../core/scheduled-moves';

export interface StepGrid {
  /** boundaries t_0 = 0 < t_1 < … < t_steps = horizon */
  times: Float64Array;
  steps: number;
  /** per step: length, expected jumps, drift of ln S before the −½v convexity term */
  dt: Float64Array;
  expectedJumps: Float64Array;
  drift: Float64Array;
  /** per step: the scheduled moves applied at its start (empty arrays for most steps) */
  movesAt: ReadonlyArray<readonly ScheduledMove[]>;
  /** whether the grid is the plain even one (no move inside the horizon, no schedule) */
  even: boolean;
}

/** Two times closer than this are one boundary. */
const SAME_TIME = 1e-10;

/**
 * @param n the number of even steps
 * @param carry r − q over the horizon (continuously compounded)
 * @param compensator the jump law's k̄ = E[e^J] − 1 (0 without jumps)
 */
export function stepGrid(
  spec: ModelSpec,
  horizon: number,
  n: number,
  carry: number,
  compensator: number,
): StepGrid {
  const evenDt = horizon / n;
  const inside = (spec.events ?? []).filter(
    (e) => e.time > SAME_TIME && e.time < horizon - SAME_TIME,
  );
  const dated = hasDatedRisk(spec);
  if (!dated || (inside.length === 0 && !spec.intensitySchedule?.length)) {
    const lambda = spec.jumps.type === 'none' ? 0 : spec.jumps.jumpIntensity;
    const drift = (carry - lambda * compensator) * evenDt;
    return {
      times: Float64Array.from({ length: n + 1 }, (_, k) => k * evenDt),
      steps: n,
      dt: new Float64Array(n).fill(evenDt),
      expectedJumps: new Float64Array(n).fill(lambda * evenDt),
      drift: new Float64Array(n).fill(drift),
      movesAt: Array.from({ length: n }, () => []),
      even: true,
    };
  }
  const bounds: number[] = Array.from({ length: n + 1 }, (_, k) => k * evenDt);
  for (const e of inside) {
    const nearest = Math.round(e.time / evenDt);
    if (Math.abs(nearest * evenDt - e.time) > SAME_TIME) bounds.push(e.time);
  }
  bounds.sort((a, b) => a - b);
  const times = Float64Array.from(
    bounds.filter((t, i) => i === 0 || t - bounds[i - 1] > SAME_TIME),
  );
  const steps = times.length - 1;
  const dt = new Float64Array(steps);
  const expected = new Float64Array(steps);
  const drift = new Float64Array(steps);
  const movesAt: ScheduledMove[][] = Array.from({ length: steps }, () => []);
  for (let k = 0; k < steps; k++) {
    dt[k] = times[k + 1] - times[k];
    expected[k] = expectedJumpsBetween(spec, times[k], times[k + 1]);
    drift[k] = carry * dt[k] - expected[k] * compensator;
  }
  for (const e of inside) movesAt[boundaryIndex(times, e.time)].push(e);
  return { times, steps, dt, expectedJumps: expected, drift, movesAt, even: false };
}

/** The index of the boundary nearest t. */
export function boundaryIndex(times: Float64Array, t: number): number {
  let lo = 0;
  let hi = times.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (times[mid] <= t) lo = mid;
    else hi = mid;
  }
  return t - times[lo] <= times[hi] - t ? lo : hi;
}

/**
 * The boundary at which an option expiring at `expiry` is settled: the nearest one (at least 1)
 * on the even grid, as always; on a grid with moves, never the boundary of a move dated before
 * the expiry, which would settle it before a move that should touch it.
 */
export function settlementStep(grid: StepGrid, expiry: number): number {
  if (grid.even) {
    const dt = grid.times[1];
    return Math.min(grid.steps, Math.max(1, Math.round(expiry / dt)));
  }
  let k = Math.min(grid.steps, Math.max(1, boundaryIndex(grid.times, expiry)));
  while (k < grid.steps && grid.movesAt[k].some((e) => e.time < expiry - SAME_TIME)) k++;
  return k;
}
