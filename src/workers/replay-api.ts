/** The hedge replay worker: runs the blocks it is given and follows single paths. */
import type { PathTrace, ReplayRequest } from '../engine/replay';

export interface ReplayBlocksDone {
  pnl: Float64Array[];
  onJumps: Float64Array[];
  premium: number;
  steps: number;
}

export interface ReplayApi {
  runBlocks(request: ReplayRequest, blocks: number[], onBlock: () => void): ReplayBlocksDone;
  trace(request: ReplayRequest, path: number): PathTrace;
}
