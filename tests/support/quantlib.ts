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

interface QlComplex {
  real(): number;
  imag(): number;
}
interface QlComplexStatics {
  new (re: number, im: number): QlComplex;
  add(a: QlComplex, b: QlComplex): QlComplex;
  sub(a: QlComplex, b: QlComplex): QlComplex;
  mul(a: QlComplex, b: QlComplex): QlComplex;
  mulScalar(a: QlComplex, s: number): QlComplex;
  subScalar(a: QlComplex, s: number): QlComplex;
  exp(a: QlComplex): QlComplex;
}
// exported at run time, though the package's typings leave it out
const Complex = (ql as unknown as { Complex: QlComplexStatics }).Complex;

type Leg = { type: 'call' | 'put'; strike: number; days: number };

function flatCurves(rate: number, dividendYield: number) {
  ql.Settings.evaluationDate.set(today);
  const dc = new ql.Actual365Fixed();
  // the package's own typings do not see FlatForward as a YieldTermStructure
  const curve = (r: number) =>
    new ql.Handle<ql.YieldTermStructure>(
      new ql.FlatForward().ffInit2(today, r, dc) as unknown as ql.YieldTermStructure,
    );
  return { rTs: curve(rate), qTs: curve(dividendYield) };
}

function npvs(engine: ql.PricingEngine, options: Leg[]): number[] {
  return options.map((o) => {
    const payoff = new ql.PlainVanillaPayoff(
      o.type === 'call' ? ql.Option.Type.Call : ql.Option.Type.Put,
      o.strike,
    );
    const option = new ql.VanillaOption(
      payoff,
      new ql.EuropeanExercise(ql.DateExt.add(today, o.days)),
    );
    option.setPricingEngine(engine);
    return option.NPV();
  });
}

/** QuantLib's AnalyticHestonEngine on flat curves (integration tolerance 1e-13). */
function hestonEngine(spot: number, rate: number, dividendYield: number, p: QlHestonParams) {
  const { rTs, qTs } = flatCurves(rate, dividendYield);
  const s0 = new ql.Handle(new ql.SimpleQuote(spot));
  const process = new ql.HestonProcess(rTs, qTs, s0, p.v0, p.kappa, p.theta, p.volOfVol, p.rho);
  return new ql.AnalyticHestonEngine().aheInit1(new ql.HestonModel(process), 1e-13, 1_000_000);
}

export interface QlJumpParams {
  jumpIntensity: number;
  jumpMean: number;
  jumpStdev: number;
}

/**
 * Bates through QuantLib's AnalyticHestonEngine with the jump add-on term written out, since the
 * packaged BatesEngine is wrong: its term is λT·exp(gν + ½δ²g² − 1 − g k̄), exponentiating the
 * whole bracket, where Bates (1996) has λT·(exp(gν + ½δ²g²) − 1 − g k̄), k̄ = e^{ν + ½δ²} − 1,
 * g = (j = 1 ? 1 : 0) + iφ. (Its BatesModel constructor also fails in this port, so the term is
 * set on a Heston engine, which is exactly how BatesEngine extends it.)
 */
export function quantlibBatesPrices(
  spot: number,
  rate: number,
  dividendYield: number,
  p: QlHestonParams & QlJumpParams,
  options: Leg[],
): number[] {
  const engine = hestonEngine(spot, rate, dividendYield, p);
  const nu = p.jumpMean;
  const half = 0.5 * p.jumpStdev * p.jumpStdev;
  const kbar = Math.exp(nu + half) - 1;
  (engine as unknown as { addOnTerm: (phi: number, t: number, j: number) => QlComplex }).addOnTerm =
    (phi, t, j) => {
      const g = new Complex(j === 1 ? 1 : 0, phi);
      const first = Complex.exp(
        Complex.add(Complex.mulScalar(g, nu), Complex.mulScalar(Complex.mul(g, g), half)),
      );
      return Complex.mulScalar(
        Complex.sub(Complex.subScalar(first, 1), Complex.mulScalar(g, kbar)),
        t * p.jumpIntensity,
      );
    };
  return npvs(engine as unknown as ql.PricingEngine, options);
}

export function quantlibHestonPrices(
  spot: number,
  rate: number,
  dividendYield: number,
  p: QlHestonParams,
  options: { type: 'call' | 'put'; strike: number; days: number }[],
): number[] {
  return npvs(hestonEngine(spot, rate, dividendYield, p), options);
}

export interface QlVolQuote {
  days: number;
  strike: number;
  impliedVol: number;
}

/**
 * QuantLib's own Heston calibration: HestonModelHelpers on implied-vol quotes, its
 * Levenberg-Marquardt, the implied-vol error type (so its objective is in vols, like ours).
 */
export function quantlibCalibrateHeston(
  spot: number,
  rate: number,
  dividendYield: number,
  quotes: QlVolQuote[],
  guess: QlHestonParams,
): QlHestonParams {
  const { rTs, qTs } = flatCurves(rate, dividendYield);
  const s0 = new ql.Handle(new ql.SimpleQuote(spot));
  const process = new ql.HestonProcess(
    rTs,
    qTs,
    s0,
    guess.v0,
    guess.kappa,
    guess.theta,
    guess.volOfVol,
    guess.rho,
  );
  const model = new ql.HestonModel(process);
  const engine = new ql.AnalyticHestonEngine().aheInit2(model, 96);
  const calendar = new ql.NullCalendar();
  const helpers = quotes.map((q) => {
    const h = new ql.HestonModelHelper().hmhInit1(
      new ql.Period().init1(q.days, ql.TimeUnit.Days),
      calendar,
      spot,
      q.strike,
      new ql.Handle(new ql.SimpleQuote(q.impliedVol)),
      rTs,
      qTs,
      ql.BlackCalibrationHelper.CalibrationErrorType.ImpliedVolError,
    );
    h.setPricingEngine(engine);
    return h;
  });
  model.calibrate1(
    helpers,
    new ql.LevenbergMarquardt(1e-8, 1e-8, 1e-8),
    new ql.EndCriteria(400, 40, 1e-8, 1e-8, 1e-8),
  );
  return {
    v0: model.v0(),
    kappa: model.kappa(),
    theta: model.theta(),
    volOfVol: model.sigma(),
    rho: model.rho(),
  };
}

/**
 * QuantLib's Monte Carlo for a European call under Black-Scholes (its MCEuropeanHestonEngine
 * stops in this port with "sequence generator dimensionality (104) != timeSteps (53)").
 */
export function quantlibMcBlackScholesCall(
  spot: number,
  rate: number,
  dividendYield: number,
  sigma: number,
  strike: number,
  days: number,
  steps: number,
  samples: number,
): { price: number; stdError: number } {
  const { rTs, qTs } = flatCurves(rate, dividendYield);
  const dc = new ql.Actual365Fixed();
  const vol = new ql.Handle<ql.BlackVolTermStructure>(
    new ql.BlackConstantVol().bcvInit1(
      today,
      new ql.TARGET(),
      sigma,
      dc,
    ) as unknown as ql.BlackVolTermStructure,
  );
  const process = new ql.BlackScholesMertonProcess(
    new ql.Handle(new ql.SimpleQuote(spot)),
    qTs,
    rTs,
    vol,
  );
  const rng = new (ql as unknown as { PseudoRandom: new () => unknown }).PseudoRandom();
  const engine = new ql.MakeMCEuropeanEngine(rng as never)
    .mmceeInit(process)
    .withSteps(steps)
    .withSamples(samples)
    .withSeed(42)
    .withAntitheticVariate(true)
    .f();
  const option = new ql.VanillaOption(
    new ql.PlainVanillaPayoff(ql.Option.Type.Call, strike),
    new ql.EuropeanExercise(ql.DateExt.add(today, days)),
  );
  option.setPricingEngine(engine);
  return { price: option.NPV(), stdError: option.errorEstimate() };
}
