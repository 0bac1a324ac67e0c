/**
 * Calls an engine function gets before its time is taken. V8 settles on its optimised code for
 * `priceOptions` on the benchmark surface only after 100–150 calls: medians of 50-call windows
 * in two fresh processes fell from 1.9 ms to 0.91–0.99 ms by the 150th call and stayed there. A
 * shorter warm-up would time the JIT as well as the engine.
 */
export const ENGINE_WARMUP = 200;

/** Median timing of a function over repeated runs, after a warm-up. */
export function medianMs(fn: () => unknown, runs: number, warmup = Math.min(5, runs)): number {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

export const fmt = (x: number, digits = 3) => x.toPrecision(digits);

/**
 * Two functions timed in alternation, so that the machine's load and the JIT's warm-up fall on
 * both alike: per round a batch of each, then the medians of their per-call times and the
 * median of the per-round ratios b/a.
 */
export function pairedMedianMs(
  a: () => unknown,
  b: () => unknown,
  rounds = 31,
  batch = 4,
  warmup = ENGINE_WARMUP / 2,
): { a: number; b: number; ratio: number } {
  for (let i = 0; i < warmup; i++) {
    a();
    b();
  }
  const timeBatch = (fn: () => unknown) => {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) fn();
    return (performance.now() - t0) / batch;
  };
  const as: number[] = [];
  const bs: number[] = [];
  const ratios: number[] = [];
  for (let r = 0; r < rounds; r++) {
    // alternate which goes first, so neither always follows the other's garbage
    let ta: number;
    let tb: number;
    if (r % 2 === 0) {
      ta = timeBatch(a);
      tb = timeBatch(b);
    } else {
      tb = timeBatch(b);
      ta = timeBatch(a);
    }
    as.push(ta);
    bs.push(tb);
    ratios.push(tb / ta);
  }
  const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)];
  return { a: median(as), b: median(bs), ratio: median(ratios) };
}
