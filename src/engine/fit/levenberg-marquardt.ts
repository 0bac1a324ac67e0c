/**
 * Levenberg-Marquardt for small nonlinear least squares, min ½‖r(x)‖², with a forward-difference
 * Jacobian and Nielsen's damping update (Madsen, Nielsen & Tingleff 2004, "Methods for
 * Non-Linear Least Squares Problems", algorithm 3.16): steps solve (JᵀJ + μ·diag(JᵀJ)) h = −Jᵀr
 * (Marquardt's scaling) by Cholesky.
 */

export interface LmOptions {
  maxIterations: number;
  /** stop when ‖Jᵀr‖∞ falls below this */
  gradientTolerance: number;
  /** stop when the step is below this relative to ‖x‖ */
  stepTolerance: number;
  /** relative finite-difference step for the Jacobian */
  jacobianStep: number;
  /** called after each accepted or rejected step; return false to stop */
  onIteration?: (iteration: number, cost: number) => boolean | void;
}

export const DEFAULT_LM: LmOptions = {
  maxIterations: 60,
  gradientTolerance: 1e-10,
  stepTolerance: 1e-9,
  jacobianStep: 1e-6,
};

export interface LmResult {
  x: Float64Array;
  residuals: Float64Array;
  /** ½‖r‖² at x */
  cost: number;
  iterations: number;
  evaluations: number;
  reason: 'gradient' | 'step' | 'iterations' | 'stopped' | 'no-progress';
}

function sumSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return 0.5 * s;
}

/** Solves A h = b for symmetric positive definite A (n×n, row-major) in place; false if not SPD. */
function choleskySolve(a: Float64Array, b: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j];
    for (let k = 0; k < j; k++) d -= a[j * n + k] ** 2;
    if (!(d > 0)) return false;
    const ljj = Math.sqrt(d);
    a[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= a[i * n + k] * a[j * n + k];
      a[i * n + j] = s / ljj;
    }
  }
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= a[i * n + k] * b[k];
    b[i] = s / a[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let k = i + 1; k < n; k++) s -= a[k * n + i] * b[k];
    b[i] = s / a[i * n + i];
  }
  return true;
}

export function levenbergMarquardt(
  residualsOf: (x: Float64Array) => Float64Array,
  start: ArrayLike<number>,
  options: Partial<LmOptions> = {},
): LmResult {
  const o = { ...DEFAULT_LM, ...options };
  const n = start.length;
  let x = Float64Array.from(start);
  let r = residualsOf(x);
  const m = r.length;
  let cost = sumSquares(r);
  let evaluations = 1;
  let mu = 1e-3;
  let nu = 2;
  const J = new Float64Array(m * n);
  const jacobian = () => {
    for (let j = 0; j < n; j++) {
      const h = o.jacobianStep * Math.max(1, Math.abs(x[j]));
      const xp = Float64Array.from(x);
      xp[j] += h;
      const rp = residualsOf(xp);
      evaluations++;
      for (let i = 0; i < m; i++) J[i * n + j] = (rp[i] - r[i]) / h;
    }
  };
  jacobian();
  for (let iter = 1; iter <= o.maxIterations; iter++) {
    const A = new Float64Array(n * n);
    const g = new Float64Array(n);
    for (let i = 0; i < m; i++) {
      for (let p = 0; p < n; p++) {
        const jp = J[i * n + p];
        g[p] += jp * r[i];
        for (let q = 0; q <= p; q++) A[p * n + q] += jp * J[i * n + q];
      }
    }
    for (let p = 0; p < n; p++) for (let q = 0; q < p; q++) A[q * n + p] = A[p * n + q];
    let gMax = 0;
    for (let p = 0; p < n; p++) gMax = Math.max(gMax, Math.abs(g[p]));
    if (gMax < o.gradientTolerance)
      return { x, residuals: r, cost, iterations: iter - 1, evaluations, reason: 'gradient' };
    const damped = Float64Array.from(A);
    for (let p = 0; p < n; p++) damped[p * n + p] += mu * Math.max(A[p * n + p], 1e-12);
    const h = Float64Array.from(g, (v) => -v);
    if (!choleskySolve(damped, h, n)) {
      mu *= nu;
      nu *= 2;
      continue;
    }
    let hNorm = 0;
    let xNorm = 0;
    for (let p = 0; p < n; p++) {
      hNorm += h[p] * h[p];
      xNorm += x[p] * x[p];
    }
    if (Math.sqrt(hNorm) < o.stepTolerance * (Math.sqrt(xNorm) + o.stepTolerance)) {
      return { x, residuals: r, cost, iterations: iter, evaluations, reason: 'step' };
    }
    const xNew = Float64Array.from(x, (v, p) => v + h[p]);
    const rNew = residualsOf(xNew);
    evaluations++;
    const costNew = sumSquares(rNew);
    // gain ratio: actual over predicted reduction, predicted = ½ hᵀ(μ D h − g)
    let predicted = 0;
    for (let p = 0; p < n; p++)
      predicted += 0.5 * h[p] * (mu * Math.max(A[p * n + p], 1e-12) * h[p] - g[p]);
    const rho = Number.isFinite(costNew) ? (cost - costNew) / predicted : -1;
    if (rho > 0) {
      x = xNew;
      r = rNew;
      cost = costNew;
      mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
      jacobian();
    } else {
      mu *= nu;
      nu *= 2;
      if (mu > 1e16)
        return { x, residuals: r, cost, iterations: iter, evaluations, reason: 'no-progress' };
    }
    if (o.onIteration?.(iter, cost) === false)
      return { x, residuals: r, cost, iterations: iter, evaluations, reason: 'stopped' };
  }
  return { x, residuals: r, cost, iterations: o.maxIterations, evaluations, reason: 'iterations' };
}
