/** Every command the engine worker answers; the page side and the worker share this contract. */
import type {
  EventMoveEstimate,
  SmileSurface,
  OptionResult,
  ParameterSensitivity,
  StrikeSpacing,
} from '../engine/analytic';
import type { DemoChainRequest } from '../engine/fit';
import type { Stress, FieldIssue, Market, Model, OptionSpec } from '../engine/core';
import type {
  LadderSpec,
  BookScenario,
  JumpExposure,
  SetRevaluation,
  Position,
  WingHedge,
  WingHedgeRequest,
} from '../engine/book';

export interface PriceRequest {
  market: Market;
  model: Model;
  options: OptionSpec[];
}

export interface PriceResponse {
  results: OptionResult[];
  elapsedMs: number;
}

export interface SmileRequest {
  market: Market;
  model: Model;
  stress?: Partial<Stress>;
  expiries: number[];
  moneyness: number[];
  /** the scenario grid's spacing: `moneyness` for every expiry unless set otherwise */
  strikeSpacing?: StrikeSpacing;
  /** expiry at which to sample the log-return density (optional) */
  densityExpiry?: number;
  /** base vol for the implied event moves; the ATM vol before each move when absent */
  eventBaseVol?: number;
}

/** ATM vols on the expiries of the term-structure chart (denser than the grid with dated risk). */
export interface AtmTerm {
  expiries: number[];
  base: (number | null)[];
  stressed: (number | null)[] | null;
}

export interface DensityCurve {
  points: number[];
  base: number[];
  stressed: number[] | null;
}

export interface SmileResponse {
  base: SmileSurface;
  stressed: SmileSurface | null;
  stressIssues: FieldIssue[];
  density: DensityCurve | null;
  term: AtmTerm;
  /** the move the base ATM term structure prices for each scheduled move */
  eventMoves: EventMoveEstimate[];
  elapsedMs: number;
  engineVersion: string;
}

export interface SensitivityRequest {
  market: Market;
  model: Model;
  expiry: number;
  moneyness: number[];
}

export interface BookRequest {
  base: BookScenario;
  scenarios: BookScenario[];
  positions: Position[];
  ladder: LadderSpec;
  /** ATM vol points added per 1 % fall, for the vol-reaction ladder */
  volReaction?: number;
}

export interface WingHedgeCall {
  market: Market;
  model: Model;
  positions: Position[];
  wingHedge: WingHedgeRequest;
}

export interface EngineApi {
  info(): { engineVersion: string };
  smiles(request: SmileRequest): SmileResponse;
  price(request: PriceRequest): PriceResponse;
  sensitivities(request: SensitivityRequest): ParameterSensitivity[];
  book(request: BookRequest): SetRevaluation;
  /** the base book's jump exposure (heavier than the revaluation: asked for after it) */
  bookJumpExposure(request: BookRequest): JumpExposure;
  /** the options to buy against the book's down-gap losses, within a premium budget */
  wingHedge(request: WingHedgeCall): WingHedge;
  /** the ladder before and after an overlay found by another measure (the replay pilot) */
  wingLadder(request: WingHedgeCall & { quantities: number[] }): WingHedge;
  /** an invented chain priced by the model, with noise and bid/ask, as CSV */
  demoChain(request: DemoChainRequest): string;
  /** density of ln(S_T/F) at the given points */
  density(model: Model, expiry: number, points: number[]): number[];
}
