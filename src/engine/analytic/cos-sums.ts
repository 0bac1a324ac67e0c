/**
 * The strike-dependent cosine sums of a COS strip (see `cos.ts`), the hot loop of every price.
 * A term's values are read from the series' interleaved table (`CosSeries.table`): A_n/u_n,
 * A_n/(1 + u_n²), A_n, u_n and, with time slopes, the same two ratios of ∂A_n/∂τ.
 */
import type { CosSeries } from './cos-series';

/**
 * The strike-dependent sums of the COS series for angles Δ_j = π(k_j − a)/(b − a):
 * S_j = Σ_{n≥1} (A_n/u_n) sin nΔ_j, C_j = Σ_{n≥1} A_n cos nΔ_j and
 * R_j = Σ_{n≥1} A_n (cos nΔ_j + u_n sin nΔ_j)/(1 + u_n²). cos/sin of nΔ come from a rotation
 * recurrence; four strikes advance together so their dependency chains overlap in the CPU.
 */
export function stripSums(
  prep: CosSeries,
  deltas: Float64Array,
  count: number,
  S: Float64Array,
  C: Float64Array,
  R: Float64Array,
): void {
  const { terms, table: x, stride } = prep;
  const end = terms * stride;
  let j = 0;
  for (; j + 4 <= count; j += 4) {
    const cd0 = Math.cos(deltas[j]),
      sd0 = Math.sin(deltas[j]);
    const cd1 = Math.cos(deltas[j + 1]),
      sd1 = Math.sin(deltas[j + 1]);
    const cd2 = Math.cos(deltas[j + 2]),
      sd2 = Math.sin(deltas[j + 2]);
    const cd3 = Math.cos(deltas[j + 3]),
      sd3 = Math.sin(deltas[j + 3]);
    let c0 = 1,
      s0 = 0,
      c1 = 1,
      s1 = 0,
      c2 = 1,
      s2 = 0,
      c3 = 1,
      s3 = 0;
    let S0 = 0,
      S1 = 0,
      S2 = 0,
      S3 = 0,
      C0 = 0,
      C1 = 0,
      C2 = 0,
      C3 = 0,
      R0 = 0,
      R1 = 0,
      R2 = 0,
      R3 = 0;
    for (let i = stride; i < end; i += stride) {
      const au = x[i],
        a2 = x[i + 1],
        an = x[i + 2],
        un = x[i + 3];
      let t = c0 * cd0 - s0 * sd0;
      s0 = s0 * cd0 + c0 * sd0;
      c0 = t;
      t = c1 * cd1 - s1 * sd1;
      s1 = s1 * cd1 + c1 * sd1;
      c1 = t;
      t = c2 * cd2 - s2 * sd2;
      s2 = s2 * cd2 + c2 * sd2;
      c2 = t;
      t = c3 * cd3 - s3 * sd3;
      s3 = s3 * cd3 + c3 * sd3;
      c3 = t;
      S0 += au * s0;
      S1 += au * s1;
      S2 += au * s2;
      S3 += au * s3;
      C0 += an * c0;
      C1 += an * c1;
      C2 += an * c2;
      C3 += an * c3;
      R0 += a2 * (c0 + un * s0);
      R1 += a2 * (c1 + un * s1);
      R2 += a2 * (c2 + un * s2);
      R3 += a2 * (c3 + un * s3);
    }
    S[j] = S0;
    S[j + 1] = S1;
    S[j + 2] = S2;
    S[j + 3] = S3;
    C[j] = C0;
    C[j + 1] = C1;
    C[j + 2] = C2;
    C[j + 3] = C3;
    R[j] = R0;
    R[j + 1] = R1;
    R[j + 2] = R2;
    R[j + 3] = R3;
  }
  for (; j < count; j++) {
    const cd = Math.cos(deltas[j]);
    const sd = Math.sin(deltas[j]);
    let cn = 1,
      sn = 0,
      sS = 0,
      sC = 0,
      sR = 0;
    for (let i = stride; i < end; i += stride) {
      const t = cn * cd - sn * sd;
      sn = sn * cd + cn * sd;
      cn = t;
      sS += x[i] * sn;
      sC += x[i + 2] * cn;
      sR += x[i + 1] * (cn + x[i + 3] * sn);
    }
    S[j] = sS;
    C[j] = sC;
    R[j] = sR;
  }
}

/**
 * `stripSums` and, in the same pass over n, S_j and R_j for the coefficients' time slopes (for a
 * calendar theta from the strip's own angles and rotations); two strikes advance together.
 * The series must carry slopes (a table of stride 6).
 */
export function stripSumsWithSlope(
  prep: CosSeries,
  deltas: Float64Array,
  count: number,
  S: Float64Array,
  C: Float64Array,
  R: Float64Array,
  dS: Float64Array,
  dR: Float64Array,
): void {
  const { terms, table: x, stride } = prep;
  if (stride !== 6) throw new Error('stripSumsWithSlope: the series has no time slopes');
  const end = terms * 6;
  for (let j = 0; j < count; j += 2) {
    const pair = j + 1 < count;
    const cd0 = Math.cos(deltas[j]),
      sd0 = Math.sin(deltas[j]);
    const cd1 = pair ? Math.cos(deltas[j + 1]) : 1,
      sd1 = pair ? Math.sin(deltas[j + 1]) : 0;
    let c0 = 1,
      s0 = 0,
      c1 = 1,
      s1 = 0;
    let S0 = 0,
      S1 = 0,
      C0 = 0,
      C1 = 0,
      R0 = 0,
      R1 = 0,
      dS0 = 0,
      dS1 = 0,
      dR0 = 0,
      dR1 = 0;
    for (let i = 6; i < end; i += 6) {
      const au = x[i],
        a2 = x[i + 1],
        an = x[i + 2],
        un = x[i + 3],
        su = x[i + 4],
        s2 = x[i + 5];
      let t = c0 * cd0 - s0 * sd0;
      s0 = s0 * cd0 + c0 * sd0;
      c0 = t;
      t = c1 * cd1 - s1 * sd1;
      s1 = s1 * cd1 + c1 * sd1;
      c1 = t;
      const w0 = c0 + un * s0;
      const w1 = c1 + un * s1;
      S0 += au * s0;
      S1 += au * s1;
      C0 += an * c0;
      C1 += an * c1;
      R0 += a2 * w0;
      R1 += a2 * w1;
      dS0 += su * s0;
      dS1 += su * s1;
      dR0 += s2 * w0;
      dR1 += s2 * w1;
    }
    S[j] = S0;
    C[j] = C0;
    R[j] = R0;
    dS[j] = dS0;
    dR[j] = dR0;
    if (pair) {
      S[j + 1] = S1;
      C[j + 1] = C1;
      R[j + 1] = R1;
      dS[j + 1] = dS1;
      dR[j + 1] = dR1;
    }
  }
}
