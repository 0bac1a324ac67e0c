/** The hedge replay worker: runs the blocks it is given and follows single paths. */
import type {
  BlockPnl,
  PilotWingHedge,
  PilotWingRequest,
  PathTrace,
  ReplayPlan,
  ReplayRequest,
  ReplayResult,
  PnlHistogram,
} from '../engine/replay';

export interface ReplayBlocksDone {
  pnl: Float64Array[];
  onJumps: Float64Array[];
  onEvents: Float64Array[];
  overlay: Float64Array[];
  premium: number;
  overlayPremium: number;
  steps: number;
}

export interface FinishedRun {
  meta: Pick<ReplayPlan, 'request' | 'steps' | 'premium' | 'overlayPremium'>;
  blocks: BlockPnl[];
  elapsedMs: number;
}

export interface ReplayApi {
  runBlocks(request: ReplayRequest, blocks: number[], onBlock: () => void): ReplayBlocksDone;
  trace(request: ReplayRequest, path: number): PathTrace;
  /** a wing hedge by the pilot run's ES99 (several small replays: seconds, so off the engine) */
  wingPilot(request: PilotWingRequest): PilotWingHedge;
  /** Joins and summarises runs (the sort for VaR and ES included) off the page's thread. */
  finish(
    runs: FinishedRun[],
    bins: number,
  ): { results: ReplayResult[]; histograms: PnlHistogram[] };
}
