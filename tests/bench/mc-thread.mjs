// A worker thread for the Monte Carlo benchmark: registers tsx, then runs the blocks it is given.
import { parentPort, workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { simulateBlock } = await import('../../src/engine/paths/simulate.ts');
const { blocks, market, model, settings } = workerData;
parentPort.postMessage(blocks.map((b) => [b, simulateBlock(market, model, settings, b)]));
