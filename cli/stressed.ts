/** A request's market and model with its stress applied; a stress out of range exits 2. */
import {
  applyStress,
  isIdentityStress,
  type Market,
  type Model,
  type Stress,
} from '../src/engine/core';
import { CliError } from './io';

export function stressedInputs(req: {
  market: unknown;
  model: unknown;
  stress?: Partial<Stress>;
}): {
  market: Market;
  model: Model;
} {
  const market = req.market as Market;
  const model = req.model as Model;
  if (isIdentityStress(req.stress)) return { market, model };
  const s = applyStress(market, model, req.stress ?? {});
  if (s.issues.length > 0)
    throw new CliError(
      'invalid-stress',
      `${s.issues[0].path}: ${s.issues[0].message}`,
      s.issues[0].path,
    );
  return { market: s.market, model: s.model };
}
