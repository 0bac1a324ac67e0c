/**
 * The N ≥ 1 jump part's series at small z = ΛE (`smallJumpSeries`) against the same two
 * functions evaluated directly in complex arithmetic: ln((e^z − 1)/z) and z/(1 − e^{−z}).
 */
import { describe, expect, it } from 'vitest';
import { smallJumpSeries } from '../../src/engine/analytic/cos-jump-split';

/** e^z − 1 for complex z, from expm1 and the half angle (no cancellation at small z). */
function expm1Complex(zr: number, zi: number): [number, number] {
  const sHalf = Math.sin(0.5 * zi);
  const em1 = Math.expm1(zr);
  return [em1 * (1 - 2 * sHalf * sHalf) - 2 * sHalf * sHalf, (1 + em1) * Math.sin(zi)];
}

function divide(ar: number, ai: number, br: number, bi: number): [number, number] {
  const m = br * br + bi * bi;
  return [(ar * br + ai * bi) / m, (ai * br - ar * bi) / m];
}

describe('the jump part at small z: series against direct evaluation', () => {
  const out = new Float64Array(4);
  // |z| from 1e-3 (where the direct forms are still accurate to rounding) to the threshold
  const radii = [1e-3, 0.005, 0.01, 0.02, 0.035, 0.0499];
  const angles = Array.from({ length: 24 }, (_, i) => (2 * Math.PI * i) / 24 + 0.1);

  // within a few ulps of 1: the z⁶ terms alone are 8.6e-14 and 5.2e-13 at |z| = 0.05, so a wrong
  // coefficient, or one term too few, shows
  it('ln((e^z − 1)/z) and z/(1 − e^{−z}) agree within 1e-15', () => {
    let worst = 0;
    for (const r of radii) {
      for (const t of angles) {
        const zr = r * Math.cos(t);
        const zi = r * Math.sin(t);
        smallJumpSeries(zr, zi, out);
        // ln((e^z − 1)/z): the quotient is near 1, so log1p of its distance from 1
        const [qr, qi] = divide(...expm1Complex(zr, zi), zr, zi);
        const logRe = 0.5 * Math.log1p(2 * (qr - 1) + (qr - 1) ** 2 + qi * qi);
        const logIm = Math.atan2(qi, qr);
        // z/(1 − e^{−z}) = −z/expm1(−z)
        const [mr, mi] = expm1Complex(-zr, -zi);
        const [br, bi] = divide(-zr, -zi, mr, mi);
        for (const d of [out[0] - logRe, out[1] - logIm, out[2] - br, out[3] - bi]) {
          worst = Math.max(worst, Math.abs(d));
        }
      }
    }
    expect(worst).toBeLessThan(1e-15);
  });
});
