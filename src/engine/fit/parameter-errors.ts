/**
 * How well a calibration pins each parameter down, from the Jacobian at the optimum (the usual
 * nonlinear least-squares asymptotics, e.g. Seber & Wild 1989, "Nonlinear Regression", ch. 2):
 * Cov = s²(JᵀJ)⁻¹ with J = ∂r/∂θ (residuals in vol points, weighted as in the fit) and
 * s² = SSE/(n − k). Standard errors are √Cov_jj; a parameter is flagged as not identified when
 * its relative error exceeds 100 % or its correlation with another exceeds 0.95 in size.
 */

export interface ParameterErrors {
  names: string[];
  /** standard error of each parameter, null when the information matrix is singular */
  standardErrors: (number | null)[];
  /** correlation matrix (rows and columns in `names` order), null when singular */
  correlations: number[][] | null;
  /** parameters the quotes do not pin down */
  unidentified: string[];
}

/** Inverse of a small symmetric positive matrix by Gauss-Jordan with partial pivoting. */
export function invert(a: number[][]): number[][] | null {
  const n = a.length;
  const m = a.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    const scale = Math.max(...a.map((row) => Math.abs(row[c])), 1e-300);
    if (!(Math.abs(m[p][c]) > 1e-13 * scale)) return null;
    [m[c], m[p]] = [m[p], m[c]];
    const d = m[c][c];
    for (let j = 0; j < 2 * n; j++) m[c][j] /= d;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = m[r][c];
      if (f !== 0) for (let j = 0; j < 2 * n; j++) m[r][j] -= f * m[c][j];
    }
  }
  return m.map((row) => row.slice(n));
}

/**
 * @param residuals weighted residuals (vol points) at natural parameter values θ
 * @param theta the optimum
 * @param steps a finite-difference step per parameter
 * @param boxes where each parameter may go: a difference that would leave the box is one-sided
 */
export function parameterErrors(
  names: readonly string[],
  theta: readonly number[],
  steps: readonly number[],
  residuals: (theta: readonly number[]) => Float64Array,
  boxes?: readonly { lo: number; hi: number }[],
): ParameterErrors {
  const k = names.length;
  const r0 = residuals(theta);
  const n = r0.length;
  const J: Float64Array[] = [];
  for (let j = 0; j < k; j++) {
    const up = [...theta];
    const down = [...theta];
    const lo = boxes?.[j].lo ?? -Infinity;
    const hi = boxes?.[j].hi ?? Infinity;
    up[j] = Math.min(hi, theta[j] + steps[j]);
    down[j] = Math.max(lo, theta[j] - steps[j]);
    const ru = residuals(up);
    const rd = residuals(down);
    const width = up[j] - down[j];
    J.push(Float64Array.from(ru, (v, i) => (width > 0 ? (v - rd[i]) / width : 0)));
  }
  const sse = r0.reduce((a, v) => a + v * v, 0);
  const s2 = sse / Math.max(1, n - k);
  const info = Array.from({ length: k }, (_, a) =>
    Array.from({ length: k }, (_, b) => J[a].reduce((acc, v, i) => acc + v * J[b][i], 0)),
  );
  const inv = invert(info);
  if (!inv)
    return {
      names: [...names],
      standardErrors: names.map(() => null),
      correlations: null,
      unidentified: [...names],
    };
  const se = inv.map((row, j) => Math.sqrt(Math.max(0, s2 * row[j])));
  const corr = inv.map((row, a) =>
    row.map((v, b) => (a === b ? 1 : v / Math.sqrt(inv[a][a] * inv[b][b]))),
  );
  const unidentified = names.filter(
    (_, j) => se[j] > Math.abs(theta[j]) || corr[j].some((c, b) => b !== j && Math.abs(c) > 0.95),
  );
  return { names: [...names], standardErrors: se, correlations: corr, unidentified };
}
