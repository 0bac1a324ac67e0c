import { expose, transfer } from 'comlink';
import { pathsView, simulateBlock } from '../engine/paths';
import type { BlocksDone, PathsApi } from './paths-api';

const api: PathsApi = {
  runBlocks(market, model, settings, blocks, onBlock) {
    const done: BlocksDone = { sums: [] };
    for (const b of blocks) {
      const sums = simulateBlock(market, model, settings, b);
      if (sums.record) {
        done.view = pathsView(sums.record);
        delete sums.record; // the view is what the page needs; the raw paths stay here
      }
      done.sums.push(sums);
      void onBlock();
    }
    const buffers: ArrayBuffer[] = [];
    for (const s of done.sums) {
      buffers.push(
        s.payoff.buffer as ArrayBuffer,
        s.payoffSq.buffer as ArrayBuffer,
        s.pairSq.buffer as ArrayBuffer,
        s.terminal.buffer as ArrayBuffer,
      );
      if (s.histogram) buffers.push(s.histogram.buffer as ArrayBuffer);
    }
    return transfer(done, buffers);
  },
};

expose(api);
