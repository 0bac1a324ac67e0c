/**
 * Standard normal distribution to near machine precision, without memorised coefficient tables.
 *
 * Tails use the Mills ratio R(z) = (1 − Φ(z)) / φ(z). Below z = 4 it is expanded as a Taylor
 * series around the nearest half-integer grid point (Marsaglia 2004, "Evaluating the Normal
 * Distribution", J. Stat. Software 11(4)) with the derivative recursion R' = zR − 1,
 * R^(n+1) = z R^(n) + n R^(n−1); at and above 4 the Laplace continued fraction
 * R(z) = 1/(z+ 1/(z+ 2/(z+ 3/(z+ …)))) converges to double precision within 50 terms. The grid
 * values come from the same continued fraction, run long, once at module load.
 */

const SQRT_2PI = Math.sqrt(2 * Math.PI);
const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
const GRID_STEP = 0.5;
const TAYLOR_LIMIT = 4;

function millsByContinuedFraction(z: number, terms: number): number {
  let tail = z;
  for (let n = terms; n >= 1; n--) tail = z + n / tail;
  return 1 / tail;
}

const MILLS_GRID = new Float64Array(TAYLOR_LIMIT / GRID_STEP + 1);
MILLS_GRID[0] = Math.sqrt(Math.PI / 2);
for (let j = 1; j < MILLS_GRID.length; j++) {
  MILLS_GRID[j] = millsByContinuedFraction(j * GRID_STEP, 20000);
}

/** 1/n for the Taylor recursion, a multiplication being cheaper than a division. */
const RECIPROCALS = Float64Array.from({ length: 122 }, (_, n) => (n === 0 ? 0 : 1 / n));

/**
 * Taylor coefficients c_n = R^(n)(z0)/n! of the Mills ratio at z0, from R(z0), into `out`.
 * The forward recursion is stable while z0·|h| stays small (errors grow like e^{z0·|h|}).
 */
function millsTaylor(z0: number, r0: number, h: number, oddOnly: boolean): number {
  let cPrev = r0;
  let cCurr = z0 * r0 - 1;
  let power = h;
  let sum = oddOnly ? cCurr * h : r0 + cCurr * h;
  for (let n = 1; n < 120; n++) {
    const cNext = (z0 * cCurr + cPrev) * RECIPROCALS[n + 1];
    power *= h;
    cPrev = cCurr;
    cCurr = cNext;
    if (oddOnly && n % 2 === 1) continue; // cNext has even index n+1
    const next = sum + cNext * power;
    if (next === sum && n > 2) break;
    sum = next;
  }
  return sum;
}

/** Mills ratio (1 − Φ(z)) / φ(z) for z ≥ 0 (relative accuracy about 1e-15). */
export function millsRatio(z: number): number {
  if (z >= TAYLOR_LIMIT) return millsByContinuedFraction(z, z < 6 ? 50 : 24);
  const j = Math.round(z / GRID_STEP);
  const z0 = j * GRID_STEP;
  return millsTaylor(z0, MILLS_GRID[j], z - z0, false);
}

/** Mills ratio for any real z: R(z) = 1/φ(z) − R(−z) when z < 0. */
export function millsRatioAnywhere(z: number): number {
  if (z >= 0) return millsRatio(z);
  return SQRT_2PI * Math.exp(0.5 * z * z) - millsRatio(-z);
}

/**
 * R(z0 − t) − R(z0 + t) = −2 Σ_{n odd} c_n(z0) tⁿ for z0 ≥ 0 and small t, free of the
 * cancellation that subtracting two nearly equal ratios would suffer.
 */
export function millsCentralDifference(z0: number, t: number): number {
  return -2 * millsTaylor(z0, millsRatio(z0), t, true);
}

/** Standard normal density φ(x). */
export function normPdf(x: number): number {
  return Math.exp(-0.5 * x * x) / SQRT_2PI;
}

/** Upper tail 1 − Φ(x), accurate in relative terms far into the tail. */
export function normUpperTail(x: number): number {
  if (x >= 0) return Math.exp(-0.5 * x * x - LN_SQRT_2PI) * millsRatio(x);
  return 1 - Math.exp(-0.5 * x * x - LN_SQRT_2PI) * millsRatio(-x);
}

/** Standard normal cumulative distribution Φ(x). */
export function normCdf(x: number): number {
  if (x <= 0) return Math.exp(-0.5 * x * x - LN_SQRT_2PI) * millsRatio(-x);
  return 1 - Math.exp(-0.5 * x * x - LN_SQRT_2PI) * millsRatio(x);
}

/**
 * Inverse of Φ: Acklam's rational approximation as a start, refined by Halley steps on the
 * accurate Φ above, so the result is accurate to a few ulps wherever Φ is.
 */
export function normInv(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    return NaN;
  }
  let x = acklam(p);
  for (let i = 0; i < 3; i++) {
    const e = p <= 0.5 ? normCdf(x) - p : -(normUpperTail(x) - (1 - p));
    const u = e * SQRT_2PI * Math.exp(0.5 * x * x);
    const step = u / (1 + 0.5 * x * u);
    x -= step;
    if (Math.abs(step) <= 1e-16 * Math.max(1, Math.abs(x))) break;
  }
  return x;
}

function acklam(p: number): number {
  const a = [
    -39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716,
    2.506628277459239,
  ];
  const b = [
    -54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972,
    -13.28068155288572,
  ];
  const c = [
    -0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734,
    4.374664141464968, 2.938163982698783,
  ];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const pLow = 0.02425;
  if (p < pLow) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (
      (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1)
    );
  }
  if (p > 1 - pLow) {
    const q = Math.sqrt(-2 * Math.log1p(-p));
    return (
      -(((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1)
    );
  }
  const q = p - 0.5;
  const r = q * q;
  return (
    ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) /
    (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1)
  );
}
