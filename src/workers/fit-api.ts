/** The calibration worker's commands. Progress comes back through a callback (a comlink proxy). */
import type {
  CalibrationRequest,
  CalibrationResult,
  FitHistoryEntry,
  JumpsVerdict,
  TargetSolution,
  TargetVol,
} from '../engine/fit';
import type { Stress, Market, Model } from '../engine/core';

export interface TargetRequest {
  market: Market;
  model: Model;
  stress: Partial<Stress>;
  targets: TargetVol[];
  also: { rho?: boolean; v0?: boolean };
}

export type Progress = (fraction: number) => void;

export interface FitApi {
  calibrate(request: CalibrationRequest, progress: Progress): CalibrationResult;
  solveTargets(request: TargetRequest, progress: Progress): TargetSolution;
  verdict(
    request: Omit<CalibrationRequest, 'model'> & {
      hestonGuess: Model & { kind: 'heston' };
      moveTime?: number;
    },
    progress: Progress,
  ): JumpsVerdict;
  /** the invented demo chain over the last days, each fitted: a history to draw */
  demoHistory(
    request: { market: Market; model: Model; valuationDate: string; days: number },
    progress: Progress,
  ): FitHistoryEntry[];
}
