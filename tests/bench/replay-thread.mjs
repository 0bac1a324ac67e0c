// A worker thread for the replay benchmark: registers tsx, plans the replay, runs its blocks.
import { parentPort, workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { planReplay, replayBlock } = await import('../../src/engine/replay/replay.ts');
const { blocks, request } = workerData;
const plan = planReplay(request);
parentPort.postMessage(blocks.map((b) => [b, replayBlock(plan, b)]));
