/** The calibration worker's commands. Progress comes back through a callback (a comlink proxy). */
import type { CalibrationRequest, CalibrationResult } from '../engine/calibrate';
import type { JumpsVerdict } from '../engine/jumps-verdict';
import type { Model } from '../engine/types';

export type Progress = (fraction: number) => void;

export interface FitApi {
  calibrate(request: CalibrationRequest, progress: Progress): CalibrationResult;
  verdict(
    request: Omit<CalibrationRequest, 'model'> & { hestonGuess: Model & { kind: 'heston' } },
    progress: Progress,
  ): JumpsVerdict;
}
