/**
 * Every model parameter, once: its label and symbol as the user reads them, its unit, the
 * domain where the model's formulas hold (what validation accepts), the box calibration
 * searches, the value a new model starts from, and the step of its form field. Model kinds
 * (`model-registry.ts`) list which of these they take.
 */
import type { StressField } from './stress-fields';

/** Where a parameter's formulas hold; an open end excludes its bound. */
export interface Domain {
  lo: number;
  hi: number;
  loOpen?: boolean;
  hiOpen?: boolean;
  /** said after the range in the refusal, e.g. " (η1 > 1)" */
  why?: string;
}

/** The box calibration searches and where its multi-start points are drawn. */
export interface FitBox {
  lo: number;
  hi: number;
  startLo: number;
  startHi: number;
  /** a calibration's starting value when the caller gives none */
  guess: number;
}

export interface ParameterSpec {
  /** in words, as on the form: "Initial variance" */
  label: string;
  /** the symbol practitioners write, or '' */
  symbol: string;
  /** the unit said after the label, or '' */
  unit: string;
  /** how the form shows it: value × scale in displayUnit (vol in %) */
  display?: { scale: number; unit: string };
  domain: Domain;
  fit: FitBox;
  default: number;
  /** form step, in displayed units */
  step: number;
  /** the stress that acts on it: a scale multiplies, a shift adds */
  stress?: { field: StressField; op: 'scale' | 'shift' };
}

export const PARAMETER_SPECS = {
  sigma: {
    label: 'Volatility',
    symbol: 'σ',
    unit: '',
    display: { scale: 100, unit: '%' },
    domain: { lo: 0, hi: 5, loOpen: true },
    fit: { lo: 0.005, hi: 3, startLo: 0.08, startHi: 0.6, guess: 0.2 },
    default: 0.2,
    step: 0.5,
  },
  v0: {
    label: 'Initial variance',
    symbol: 'v₀',
    unit: '',
    domain: { lo: 0, hi: 5 },
    fit: { lo: 1e-5, hi: 2, startLo: 0.005, startHi: 0.2, guess: 0.04 },
    default: 0.04,
    step: 0.005,
    stress: { field: 'v0Scale', op: 'scale' },
  },
  kappa: {
    label: 'Mean reversion',
    symbol: 'κ',
    unit: '',
    domain: { lo: 0, hi: 100, loOpen: true },
    fit: { lo: 0.01, hi: 25, startLo: 0.3, startHi: 6, guess: 1.5 },
    default: 1.5,
    step: 0.1,
  },
  theta: {
    label: 'Long-run variance',
    symbol: 'θ',
    unit: '',
    domain: { lo: 0, hi: 5, loOpen: true },
    fit: { lo: 1e-5, hi: 2, startLo: 0.005, startHi: 0.2, guess: 0.04 },
    default: 0.04,
    step: 0.005,
  },
  volOfVol: {
    label: 'Vol of vol',
    symbol: 'ξ',
    unit: '',
    domain: { lo: 0, hi: 10 },
    fit: { lo: 0.005, hi: 5, startLo: 0.1, startHi: 1.5, guess: 0.5 },
    default: 0.5,
    step: 0.05,
    stress: { field: 'volOfVolScale', op: 'scale' },
  },
  rho: {
    label: 'Correlation',
    symbol: 'ρ',
    unit: '',
    domain: { lo: -1, hi: 1 },
    fit: { lo: -0.999, hi: 0.999, startLo: -0.9, startHi: 0.2, guess: -0.6 },
    default: -0.7,
    step: 0.05,
  },
  jumpIntensity: {
    label: 'Intensity',
    symbol: 'λ',
    unit: 'per year',
    domain: { lo: 0, hi: 1000 },
    fit: { lo: 1e-4, hi: 20, startLo: 0.05, startHi: 3, guess: 0.3 },
    default: 0.5,
    step: 0.1,
    stress: { field: 'jumpIntensityScale', op: 'scale' },
  },
  jumpMean: {
    label: 'Mean log-jump',
    symbol: 'μJ',
    unit: '',
    domain: { lo: -5, hi: 5 },
    fit: { lo: -1.5, hi: 0.5, startLo: -0.3, startHi: 0.05, guess: -0.08 },
    default: -0.1,
    step: 0.01,
    stress: { field: 'jumpMeanShift', op: 'shift' },
  },
  jumpStdev: {
    label: 'Jump spread',
    symbol: 'σJ',
    unit: '',
    domain: { lo: 0, hi: 5 },
    fit: { lo: 0.001, hi: 1.5, startLo: 0.02, startHi: 0.3, guess: 0.1 },
    default: 0.15,
    step: 0.01,
    stress: { field: 'jumpStdevScale', op: 'scale' },
  },
  upProbability: {
    label: 'Up probability',
    symbol: 'p',
    unit: '',
    domain: { lo: 0, hi: 1 },
    fit: { lo: 0.001, hi: 0.999, startLo: 0.1, startHi: 0.6, guess: 0.3 },
    default: 0.3,
    step: 0.05,
  },
  upMean: {
    label: 'Mean up log-jump',
    symbol: '',
    unit: '',
    domain: { lo: 0, hi: 1, hiOpen: true, why: ' (η1 > 1)' },
    fit: { lo: 0.001, hi: 0.6, startLo: 0.01, startHi: 0.15, guess: 0.04 },
    default: 0.05,
    step: 0.01,
  },
  downMean: {
    label: 'Mean down log-jump',
    symbol: '',
    unit: '',
    domain: { lo: 0, hi: 5 },
    fit: { lo: 0.001, hi: 1.5, startLo: 0.02, startHi: 0.3, guess: 0.08 },
    default: 0.08,
    step: 0.01,
  },
  varianceJumpMean: {
    label: 'Mean variance jump',
    symbol: 'μV',
    unit: '',
    domain: { lo: 0, hi: 5 },
    fit: { lo: 0, hi: 1, startLo: 0.005, startHi: 0.15, guess: 0.04 },
    default: 0.04,
    step: 0.01,
    stress: { field: 'varianceJumpScale', op: 'scale' },
  },
  jumpCorrelation: {
    label: 'Jump correlation',
    symbol: 'ρJ',
    unit: '',
    domain: { lo: -5, hi: 5 },
    fit: { lo: -3, hi: 1, startLo: -1, startHi: 0, guess: -0.5 },
    default: -0.5,
    step: 0.05,
    stress: { field: 'jumpCorrelationShift', op: 'shift' },
  },
} as const satisfies Record<string, ParameterSpec>;

export type ParameterKey = keyof typeof PARAMETER_SPECS;

export const parameterSpec = (key: ParameterKey): ParameterSpec => PARAMETER_SPECS[key];

/** "Intensity λ (per year)": the label, symbol and unit as one form label. */
export function parameterLabel(key: ParameterKey): string {
  const p: ParameterSpec = PARAMETER_SPECS[key];
  return [p.label, p.symbol, p.unit ? `(${p.unit})` : ''].filter(Boolean).join(' ');
}

/** The refusal for a value outside the domain, in the words validation has always used. */
export function domainMessage(d: Domain): string {
  if (d.hiOpen) return `must be at least ${d.lo} and below ${d.hi}${d.why ?? ''}`;
  if (d.loOpen) return `must be above ${d.lo} and at most ${d.hi}${d.why ?? ''}`;
  return `must be between ${d.lo} and ${d.hi}${d.why ?? ''}`;
}

export function inDomain(x: number, d: Domain): boolean {
  return (d.loOpen ? x > d.lo : x >= d.lo) && (d.hiOpen ? x < d.hi : x <= d.hi);
}

export const isParameterKey = (key: string): key is ParameterKey =>
  Object.hasOwn(PARAMETER_SPECS, key);
