/** `wing-hedge`: the options to buy against a book's down-gap losses, within a premium budget. */
import { z } from 'zod';
import { marketSchema, modelSchema, stressSchema } from '../src/engine/core';
import {
  positionsSchema,
  suggestWingHedge,
  wingHedgeSchema,
  type Position,
} from '../src/engine/book';
import { parse } from './io';
import { stressedInputs } from './stressed';

const request = z.object({
  market: marketSchema,
  model: modelSchema,
  stress: stressSchema.optional(),
  positions: positionsSchema,
  wingHedge: wingHedgeSchema,
});

export function wingHedge(raw: unknown) {
  const req = parse(request, raw);
  const { market, model } = stressedInputs(req);
  const started = performance.now();
  const w = suggestWingHedge(market, model, req.positions as Position[], req.wingHedge);
  return {
    overlay: req.wingHedge.instruments
      .map((o, j) => ({ ...o, quantity: w.quantities[j], price: w.prices[j] }))
      .filter((o) => o.quantity > 0),
    premium: w.premium,
    worstBefore: w.worstBefore,
    worstAfter: w.worstAfter,
    ladder: w.moves.map((move, i) => ({ move, before: w.before[i], after: w.after[i] })),
    elapsedMs: performance.now() - started,
  };
}
