/**
 * `@quantlib/ql` as an outside reference. Its AnalyticHestonEngine is sound; its BatesEngine's
 * jump add-on term is wrong, so only the Heston engine is used here. Expiries are whole days on
 * ACT/365 so that T = days/365 exactly.
 */
import * as ql from '@quantlib/ql';

export interface QlHestonParams {
  kappa: number;
  theta: number;
  volOfVol: number;
  rho: number;
  v0: number;
}

const today = ql.DateExt.UTC('1,December,2026');

export function quantlibHestonPrices(
  spot: number,
  rate: number,
  dividendYield: number,
  p: QlHestonParams,
  options: { type: 'call' | 'put'; strike: number; days: number }[],
): number[] {
  ql.Settings.evaluationDate.set(today);
  const dc = new ql.Actual365Fixed();
  // the package's own typings do not see FlatForward as a YieldTermStructure
  const curve = (r: number) =>
    new ql.Handle<ql.YieldTermStructure>(
      new ql.FlatForward().ffInit2(today, r, dc) as unknown as ql.YieldTermStructure,
    );
  const rTs = curve(rate);
  const qTs = curve(dividendYield);
  const s0 = new ql.Handle(new ql.SimpleQuote(spot));
  const process = new ql.HestonProcess(rTs, qTs, s0, p.v0, p.kappa, p.theta, p.volOfVol, p.rho);
  const engine = new ql.AnalyticHestonEngine().aheInit1(
    new ql.HestonModel(process),
    1e-13,
    1_000_000,
  );
  return options.map((o) => {
    const payoff = new ql.PlainVanillaPayoff(
      o.type === 'call' ? ql.Option.Type.Call : ql.Option.Type.Put,
      o.strike,
    );
    const exercise = new ql.EuropeanExercise(ql.DateExt.add(today, o.days));
    const option = new ql.VanillaOption(payoff, exercise);
    option.setPricingEngine(engine);
    return option.NPV();
  });
}
