/** The Monte Carlo worker: runs the blocks it is given and hands their sums back (transferred). */
import type { PathsView, BlockSums, SimulationSettings } from '../engine/paths';
import type { Market, Model } from '../engine/core';

export interface BlocksDone {
  sums: BlockSums[];
  /** from block 0's recorded paths, when this batch had it */
  view?: PathsView;
}

export interface PathsApi {
  runBlocks(
    market: Market,
    model: Model,
    settings: SimulationSettings,
    blocks: number[],
    onBlock: () => void,
  ): BlocksDone;
}
