import { expose } from 'comlink';
import { buildDemoHistory, calibrate, jumpsVerdict, solveToTargets } from '../engine/fit';
import type { FitApi } from './fit-api';

const api: FitApi = {
  calibrate: (request, progress) => calibrate(request, (f) => void progress(f)),
  solveTargets: (r, progress) =>
    solveToTargets(r.market, r.model, r.stress, r.targets, r.also, (f) => void progress(f)),
  verdict: (request, progress) => jumpsVerdict({ ...request, progress: (f) => void progress(f) }),
  demoHistory: (request, progress) => buildDemoHistory(request, (f) => void progress(f)),
};

expose(api);
