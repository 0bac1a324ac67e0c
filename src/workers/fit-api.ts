/** The calibration worker's commands. Progress comes back through a callback (a comlink proxy). */
import type { CalibrationRequest, CalibrationResult } from '../engine/calibrate';
import type { JumpsVerdict } from '../engine/jumps-verdict';
import type { TargetSolution, TargetVol } from '../engine/solve-to-targets';
import type { Stress } from '../engine/stress';
import type { Market, Model } from '../engine/types';

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
    request: Omit<CalibrationRequest, 'model'> & { hestonGuess: Model & { kind: 'heston' } },
    progress: Progress,
  ): JumpsVerdict;
}
