/**
 * Random numbers for Monte Carlo: each block of paths gets its own xoshiro128** generator
 * (Blackman & Vigna 2018, "Scrambled linear pseudorandom number generators"), whose state is
 * drawn with seedrandom from "seed:block", so any block can be rerun alone, on any machine.
 * Normals by Marsaglia's polar method (Marsaglia & Bray 1964).
 */
import seedrandom from 'seedrandom';

export class BlockRandom {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spare = 0;
  private hasSpare = false;

  constructor(seed: number, block: number) {
    const init = seedrandom.alea(`saltation:${seed}:${block}`);
    this.s0 = init.int32() | 0;
    this.s1 = init.int32() | 0;
    this.s2 = init.int32() | 0;
    this.s3 = init.int32() | 0;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** Uniform on (0, 1), 32 bits of resolution, never 0 or 1. */
  uniform(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9);
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return ((result >>> 0) + 0.5) / 4294967296;
  }

  normal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let u: number, v: number, s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * f;
    this.hasSpare = true;
    return u * f;
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
