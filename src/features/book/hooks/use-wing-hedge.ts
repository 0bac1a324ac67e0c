/**
 * The wing-hedge suggestion for the Book page: by the ladder (engine worker, instant) or by a
 * pilot replay's ES99 (a replay worker, seconds), then the ladder before and after either way.
 */
import { useMutation } from '@tanstack/react-query';
import {
  inUnderlyingUnits,
  type Position,
  type WingHedge,
  type WingHedgeRequest,
} from '../../../engine/book';
import type { Market, Model } from '../../../engine/core';
import type { Leg, PilotWingHedge } from '../../../engine/replay';
import { engineWorker } from '../../../workers/engine-client';
import { wingPilotInWorker } from '../../../workers/replay-pool';

export type WingObjective = 'ladder' | 'pilot';

/** The pilot: this many paths, hedged by model delta once a day at 1 bp. */
export const PILOT_PATHS = 2000;

export interface WingAsk {
  objective: WingObjective;
  wingHedge: WingHedgeRequest;
  seed: number;
}

export interface WingAnswer {
  ladder: WingHedge;
  pilot: PilotWingHedge | null;
  ask: WingAsk;
}

/** The option legs of a book, as a replay takes them (quantity in units of the underlying). */
export const replayLegs = (positions: readonly Position[]): Leg[] =>
  inUnderlyingUnits(positions)
    .filter((p) => p.type !== 'underlying')
    .map((p) => ({
      type: p.type as 'call' | 'put',
      strike: p.strike!,
      expiry: p.expiry!,
      quantity: p.quantity,
    }));

export function useWingHedge(market: Market, model: Model, positions: Position[]) {
  return useMutation({
    mutationFn: async (ask: WingAsk): Promise<WingAnswer> => {
      const call = { market, model, positions, wingHedge: ask.wingHedge };
      if (ask.objective === 'ladder')
        return { ladder: await engineWorker().wingHedge(call), pilot: null, ask };
      const pilot = await wingPilotInWorker({
        replay: {
          market,
          model,
          position: replayLegs(positions),
          hedge: { method: 'model-delta', rebalancesPerDay: 1, costBps: 1 },
          paths: PILOT_PATHS,
          seed: ask.seed,
        },
        instruments: ask.wingHedge.instruments,
        budget: ask.wingHedge.budget,
      });
      const ladder = await engineWorker().wingLadder({ ...call, quantities: pilot.quantities });
      return { ladder, pilot, ask };
    },
  });
}
