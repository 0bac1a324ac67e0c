/**
 * One time step of a simulated path, shared by Monte Carlo and hedge replay: the diffusion part
 * (exact for constant variance; Andersen 2008 QE with his martingale correction, γ1 = γ2 = ½,
 * ψc = 1.5; or full-truncation Euler) and the compound-Poisson jumps with their compensator.
 */
import type { JumpLaw, ModelSpec } from '../analytic/characteristic';
import { twoPointOutcomes, type ScheduledMove } from '../core/scheduled-moves';
import type { BlockRandom } from './random';

/**
 * Returns a step that advances state = [x = ln(S/S0), v] in place, given two normals and a
 * uniform; `drift` is the step's (r − q − λk̄)Δ.
 */
export function diffusionStep(
  spec: ModelSpec,
  scheme: 'qe' | 'euler',
  dt: number,
  drift: number,
): (state: Float64Array, z1: number, z2: number, u: number) => void {
  const d = spec.diffusion;
  if (d.type === 'constant') {
    const sd = Math.sqrt(d.variance * dt);
    const mu = drift - 0.5 * d.variance * dt;
    return (st, z1) => {
      st[0] += mu + sd * z1;
    };
  }
  const { kappa, theta, volOfVol: xi, rho } = d;
  if (scheme === 'euler' || xi === 0) {
    const rhoBar = Math.sqrt(1 - rho * rho);
    return (st, z1, z2) => {
      const v = st[1];
      const vp = Math.max(v, 0);
      st[1] = v + kappa * (theta - vp) * dt + xi * Math.sqrt(vp * dt) * z2;
      st[0] += drift - 0.5 * vp * dt + Math.sqrt(vp * dt) * (rho * z2 + rhoBar * z1);
    };
  }
  const ekd = Math.exp(-kappa * dt);
  const k0 = (-rho * kappa * theta * dt) / xi;
  const k1 = 0.5 * dt * ((kappa * rho) / xi - 0.5) - rho / xi;
  const k2 = 0.5 * dt * ((kappa * rho) / xi - 0.5) + rho / xi;
  const k3 = 0.5 * dt * (1 - rho * rho);
  const A = k2 + 0.5 * k3;
  return (st, z1, z2, u) => {
    const v = st[1];
    const m = theta + (v - theta) * ekd;
    const s2 =
      (v * xi * xi * ekd * (1 - ekd)) / kappa +
      (theta * xi * xi * (1 - ekd) * (1 - ekd)) / (2 * kappa);
    const psi = s2 / (m * m);
    let vNext: number;
    let k0Star: number;
    if (psi <= 1.5) {
      const i2 = 2 / psi;
      const b2 = i2 - 1 + Math.sqrt(i2) * Math.sqrt(i2 - 1);
      const a = m / (1 + b2);
      const b = Math.sqrt(b2);
      vNext = a * (b + z2) * (b + z2);
      k0Star =
        A < 1 / (2 * a)
          ? (-A * b2 * a) / (1 - 2 * A * a) + 0.5 * Math.log(1 - 2 * A * a) - (k1 + 0.5 * k3) * v
          : k0;
    } else {
      const pp = (psi - 1) / (psi + 1);
      const beta = (1 - pp) / m;
      vNext = u <= pp ? 0 : Math.log((1 - pp) / (1 - u)) / beta;
      k0Star = A < beta ? -Math.log(pp + (beta * (1 - pp)) / (beta - A)) - (k1 + 0.5 * k3) * v : k0;
    }
    st[0] += drift + k0Star + k1 * v + k2 * vNext + Math.sqrt(Math.max(0, k3 * (v + vNext))) * z1;
    st[1] = vNext;
  };
}

/**
 * A step's jumps: called with the step's expected jump count `lam` and e^{−lam}, it returns the
 * sum of the step's log-jumps (0 when none) and leaves the sum of their variance jumps in
 * `varianceJump` (SVCJ; 0 for every other law).
 */
export interface JumpDraw {
  (rng: BlockRandom, lam: number, p0: number): number;
  varianceJump: number;
}

/**
 * The jump draw of a law, or null for a model without jumps. SVCJ's jumps are exact (Duffie,
 * Pan & Singleton 2000): per jump Z_V = −μV ln U (exponential) and Z_S = μS + ρJ·Z_V + σS·N.
 */
export function jumpSampler(jl: JumpLaw): JumpDraw | null {
  if (jl.type === 'none') return null;
  let size: (rng: BlockRandom) => number;
  if (jl.type === 'lognormal') size = (rng) => jl.jumpMean + jl.jumpStdev * rng.normal();
  else if (jl.type === 'double-exponential')
    size = (rng) =>
      rng.uniform() < jl.upProbability
        ? -jl.upMean * Math.log(rng.uniform())
        : jl.downMean * Math.log(rng.uniform());
  else
    size = (rng) => {
      const zv = -jl.varianceJumpMean * Math.log(rng.uniform());
      draw.varianceJump += zv;
      return jl.jumpMean + jl.jumpCorrelation * zv + jl.jumpStdev * rng.normal();
    };
  const draw = ((rng: BlockRandom, lam: number, p0: number) => {
    draw.varianceJump = 0;
    if (!(lam > 0)) return 0;
    // Poisson count by inversion (λΔ is small), then the sum of that many log-jumps
    let u = rng.uniform();
    let k = 0;
    let p = p0;
    let total = 0;
    while (u > p && k < 50) {
      u -= p;
      k++;
      p *= lam / k;
      total += size(rng);
    }
    return total;
  }) as JumpDraw;
  draw.varianceJump = 0;
  return draw;
}

/** k̄ = E[e^J] − 1 for one jump (0 without jumps). */
export function meanRelativeJump(jl: JumpLaw): number {
  if (jl.type === 'lognormal') return Math.expm1(jl.jumpMean + 0.5 * jl.jumpStdev * jl.jumpStdev);
  if (jl.type === 'price-variance')
    return (
      Math.exp(jl.jumpMean + 0.5 * jl.jumpStdev * jl.jumpStdev) /
        (1 - jl.jumpCorrelation * jl.varianceJumpMean) -
      1
    );
  if (jl.type === 'double-exponential')
    return jl.upProbability / (1 - jl.upMean) + (1 - jl.upProbability) / (1 + jl.downMean) - 1;
  return 0;
}

/** A scheduled move's log-move X drawn from its law (one normal, or one uniform). */
export function drawMove(e: ScheduledMove, rng: BlockRandom): number {
  if (e.law === 'normal') return -0.5 * e.stdev * e.stdev + e.stdev * rng.normal();
  const { up, down, p } = twoPointOutcomes(e);
  return rng.uniform() < p ? up : down;
}
