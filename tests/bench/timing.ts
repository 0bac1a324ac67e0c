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
