/**
 * Stress: shocks layered on a scenario's base parameters. Which parameter each stress field
 * moves, and how, is in the parameter table; a kind whose jump law needs more says so in its
 * registry entry. A stressed set that leaves the model's domain is reported, never clipped.
 */
import { modelEntry } from './model-registry';
import { PARAMETER_SPECS, type ParameterSpec } from './parameters';
import { NO_STRESS, STRESS_FIELDS, type Stress } from './stress-fields';
import type { Market, Model } from './types';
import type { ScheduledMove } from './scheduled-moves';
import { validateModel, type FieldIssue } from './validate';

export { NO_STRESS, STRESS_FIELDS, type Stress, type StressField } from './stress-fields';

export function isIdentityStress(s: Partial<Stress> | undefined): boolean {
  if (!s) return true;
  const full = { ...NO_STRESS, ...s };
  return STRESS_FIELDS.every((k) => full[k] === NO_STRESS[k]);
}

export interface StressedScenario {
  market: Market;
  model: Model;
  issues: FieldIssue[];
}

/**
 * A scheduled move made `f` times as large: a normal move's s.d., a two-point move's up and
 * down moves (a fall is capped at −99 %).
 */
export function scaleMove(e: ScheduledMove, f: number): ScheduledMove {
  if (e.law === 'normal') return { ...e, stdev: e.stdev * f };
  return { ...e, up: e.up * f, down: Math.max(-0.99, e.down * f) };
}

/** The scenario's variants with every scheduled move made bigger and smaller, for a set. */
export const MOVE_VARIANT_SCALES = [1.5, 0.5] as const;

/** The model with every scheduled move `f` times as large. */
export function withScaledMoves(model: Model, f: number): Model {
  return model.events
    ? ({ ...model, events: model.events.map((e) => scaleMove(e, f)) } as Model)
    : model;
}

export function applyStress(
  market: Market,
  model: Model,
  stress: Partial<Stress>,
): StressedScenario {
  const s = { ...NO_STRESS, ...stress };
  const stressedMarket: Market = { ...market, spot: market.spot * (1 + s.spotShift) };
  const m: Record<string, unknown> = { ...model };
  const entry = modelEntry(model.kind);
  for (const group of entry.groups)
    for (const key of group.parameters) {
      const rule = (PARAMETER_SPECS[key] as ParameterSpec).stress;
      if (!rule) continue;
      const x = model[key] as number;
      m[key] = rule.op === 'scale' ? x * s[rule.field] : x + s[rule.field];
    }
  if (entry.stressJumps) Object.assign(m, entry.stressJumps(model, s));
  // the intensity scale acts on the whole schedule; the event scale on every scheduled move
  if (model.jumpIntensitySchedule && s.jumpIntensityScale !== 1)
    m.jumpIntensitySchedule = model.jumpIntensitySchedule.map(
      ([t, l]) => [t, l * s.jumpIntensityScale] as [number, number],
    );
  if (model.events && s.eventSizeScale !== 1)
    m.events = model.events.map((e) => scaleMove(e, s.eventSizeScale));
  const stressed = m as Model;
  const issues: FieldIssue[] = [];
  if (!(stressedMarket.spot > 0)) {
    issues.push({ path: 'stress.spotShift', message: 'the stressed spot must stay above zero' });
  }
  for (const issue of validateModel(stressed)) {
    issues.push({ path: `stress → model.${issue.path}`, message: issue.message });
  }
  return { market: stressedMarket, model: stressed, issues };
}
