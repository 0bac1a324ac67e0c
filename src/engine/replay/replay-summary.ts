/**
 * Summaries of a hedge replay's per-path P&L: moments, 99 % VaR and expected shortfall, the
 * worst path, the split between steps with and without a jump, a histogram, and a digest of
 * every path's P&L bits so two runs can be compared to the last bit.
 */

export interface ReplaySummary {
  pnl: { mean: number; stdev: number; var99: number; es99: number; worst: number };
  /**
   * mean P&L booked on steps with a scheduled move, on steps with a jump (and no move), and on
   * the rest, and the same over the worst 1 % of paths
   */
  attribution: {
    diffusion: number;
    jumps: number;
    events: number;
    tailDiffusion: number;
    tailJumps: number;
    tailEvents: number;
  };
  /** the index of the worst path, for drill-down */
  worstPath: number;
  /** the overlay's own P&L (payoffs less premium, unhedged), when the run has an overlay */
  overlayPnl?: { mean: number; stdev: number };
  /** FNV-1a over the IEEE-754 bits of every path's P&L, in path order */
  digest: string;
}

export function summariseReplay(
  pnl: Float64Array,
  onJumps: Float64Array,
  onEvents: Float64Array = new Float64Array(pnl.length),
  overlay: Float64Array | null = null,
): ReplaySummary {
  const n = pnl.length;
  let sum = 0;
  let sq = 0;
  let jumpSum = 0;
  let eventSum = 0;
  for (let i = 0; i < n; i++) {
    sum += pnl[i];
    sq += pnl[i] * pnl[i];
    jumpSum += onJumps[i];
    eventSum += onEvents[i];
  }
  const mean = sum / n;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => pnl[a] - pnl[b] || a - b);
  const tail = Math.max(1, Math.floor(0.01 * n));
  let tailSum = 0;
  let tailJumps = 0;
  let tailEvents = 0;
  for (let i = 0; i < tail; i++) {
    tailSum += pnl[order[i]];
    tailJumps += onJumps[order[i]];
    tailEvents += onEvents[order[i]];
  }
  return {
    pnl: {
      mean,
      stdev: Math.sqrt(Math.max(0, sq / n - mean * mean)),
      var99: -pnl[order[tail - 1]],
      es99: -tailSum / tail,
      worst: pnl[order[0]],
    },
    attribution: {
      diffusion: mean - jumpSum / n - eventSum / n,
      jumps: jumpSum / n,
      events: eventSum / n,
      tailDiffusion: tailSum / tail - tailJumps / tail - tailEvents / tail,
      tailJumps: tailJumps / tail,
      tailEvents: tailEvents / tail,
    },
    worstPath: order[0],
    ...(overlay ? { overlayPnl: meanStdev(overlay) } : {}),
    digest: digestBits(pnl),
  };
}

function meanStdev(values: Float64Array): { mean: number; stdev: number } {
  let sum = 0;
  let sq = 0;
  for (let i = 0; i < values.length; i++) {
    sum += values[i];
    sq += values[i] * values[i];
  }
  const mean = sum / values.length;
  return { mean, stdev: Math.sqrt(Math.max(0, sq / values.length - mean * mean)) };
}

/** Two 32-bit FNV-1a streams (different offset bases) over the little-endian bytes. */
export function digestBits(values: Float64Array): string {
  const view = new DataView(values.buffer, values.byteOffset, values.byteLength);
  let a = 0x811c9dc5;
  let b = 0x050c5d1f;
  for (let i = 0; i < values.byteLength; i++) {
    const byte = view.getUint8(i);
    a = Math.imul(a ^ byte, 0x01000193);
    b = Math.imul(b ^ byte, 0x01000193) ^ (i & 0xff);
  }
  return (a >>> 0).toString(16).padStart(8, '0') + (b >>> 0).toString(16).padStart(8, '0');
}

export interface PnlHistogram {
  lo: number;
  hi: number;
  counts: number[];
}

/** Counts on `bins` equal bins over [lo, hi]; values outside are put in the edge bins. */
export function pnlHistogram(
  pnl: Float64Array,
  lo: number,
  hi: number,
  bins: number,
): PnlHistogram {
  const counts = new Array<number>(bins).fill(0);
  const width = hi > lo ? (hi - lo) / bins : 1;
  for (let i = 0; i < pnl.length; i++) {
    const k = Math.floor((pnl[i] - lo) / width);
    counts[Math.min(bins - 1, Math.max(0, k))]++;
  }
  return { lo, hi, counts };
}

function range(values: Float64Array): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < lo) lo = values[i];
    if (values[i] > hi) hi = values[i];
  }
  return [lo, hi];
}

/** Histograms of several runs' P&L on shared bins over their joint range. */
export function sharedHistograms(runs: Float64Array[], bins: number): PnlHistogram[] {
  const ranges = runs.map(range);
  const lo = Math.min(...ranges.map((r) => r[0]));
  const hi = Math.max(...ranges.map((r) => r[1]));
  return runs.map((pnl) => pnlHistogram(pnl, lo, hi, bins));
}
