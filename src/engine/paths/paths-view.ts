/** What the Paths page draws, computed next to the simulation (in the worker), not in the page. */
import type { PathRecord } from './simulate';

export const FAN_PERCENTILES = [0.01, 0.05, 0.25, 0.5, 0.75, 0.95, 0.99];

export interface PathsView {
  times: number[];
  /** spot and variance percentiles over time: [percentile][time] */
  spotFan: number[][];
  varianceFan: number[][];
  /** a few individual paths: [path][time] */
  samples: number[][];
  /** paths with 0, 1, 2, … 9, 10+ jumps (from the recorded block) */
  jumpCountHistogram: number[];
  /** histogram of the log-size of each step's jumps in the recorded block */
  jumpSizes: { centres: number[]; counts: number[] };
}

function percentileRows(values: Float32Array, paths: number, obs: number): number[][] {
  const rows = FAN_PERCENTILES.map(() => new Array<number>(obs));
  const column = new Float64Array(paths);
  for (let t = 0; t < obs; t++) {
    for (let p = 0; p < paths; p++) column[p] = values[p * obs + t];
    column.sort();
    FAN_PERCENTILES.forEach(
      (q, i) => (rows[i][t] = column[Math.min(paths - 1, Math.floor(q * paths))]),
    );
  }
  return rows;
}

export function pathsView(record: PathRecord, sampleCount = 24): PathsView {
  const obs = record.times.length;
  const paths = record.jumpCounts.length;
  const jumpCountHistogram = new Array(11).fill(0);
  for (const c of record.jumpCounts) jumpCountHistogram[Math.min(10, c)]++;
  const sizes = record.jumpSizes.subarray(0, record.jumpSizeCount);
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of sizes) {
    lo = Math.min(lo, x);
    hi = Math.max(hi, x);
  }
  const bins = 40;
  const width = sizes.length > 0 && hi > lo ? (hi - lo) / bins : 1;
  const counts = new Array(sizes.length > 0 ? bins : 0).fill(0);
  for (const x of sizes) counts[Math.min(bins - 1, Math.floor((x - lo) / width))]++;
  return {
    jumpSizes: { centres: counts.map((_, i) => lo + (i + 0.5) * width), counts },
    times: Array.from(record.times),
    spotFan: percentileRows(record.spot, paths, obs),
    varianceFan: percentileRows(record.variance, paths, obs),
    samples: Array.from({ length: Math.min(sampleCount, paths) }, (_, p) =>
      Array.from(record.spot.subarray(p * obs, (p + 1) * obs)),
    ),
    jumpCountHistogram,
  };
}
