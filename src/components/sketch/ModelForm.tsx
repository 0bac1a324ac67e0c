import type { ReactNode } from 'react';
import type { Market, Model, ModelKind } from '../../engine/types';
import { MODEL_KINDS } from '../../engine/types';
import { convertModel, KIND_LABELS } from './model-kinds';
import { NumberField } from './NumberField';

interface Props {
  market: Market;
  model: Model;
  errors: Record<string, string>;
  onMarket: (market: Market) => void;
  onModel: (model: Model) => void;
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="space-y-2 border-t border-rule pt-3">
      <legend className="pr-2 text-xs font-semibold uppercase tracking-wide text-muted">
        {title}
      </legend>
      {children}
    </fieldset>
  );
}

export function ModelForm({ market, model, errors, onMarket, onModel }: Props) {
  // one setter per field keeps the JSX short; `key` is a field of the current kind
  const set = (key: string) => (v: number) => onModel({ ...model, [key]: v } as Model);
  const err = (key: string) => errors[`model.${key}`];
  const hasHeston =
    model.kind === 'heston' || model.kind === 'bates' || model.kind === 'heston-kou';
  const feller = hasHeston ? 2 * model.kappa * model.theta - model.volOfVol ** 2 : null;
  return (
    <div className="space-y-4">
      <Group title="Market">
        <NumberField
          label="Spot"
          value={market.spot}
          step={1}
          error={errors['market.spot']}
          onChange={(v) => onMarket({ ...market, spot: v })}
        />
        <NumberField
          label="Rate (cont.)"
          value={market.rate ?? 0}
          scale={100}
          unit="%"
          step={0.1}
          error={errors['market.rate']}
          onChange={(v) => onMarket({ ...market, rate: v })}
        />
        <NumberField
          label="Dividend yield"
          value={market.dividendYield ?? 0}
          scale={100}
          unit="%"
          step={0.1}
          error={errors['market.dividendYield']}
          onChange={(v) => onMarket({ ...market, dividendYield: v })}
        />
      </Group>
      <label className="flex flex-col gap-1 text-sm">
        <span className="text-xs font-semibold uppercase tracking-wide text-muted">Model</span>
        <select
          value={model.kind}
          onChange={(e) => onModel(convertModel(model, e.target.value as ModelKind))}
          className="rounded border border-rule bg-panel px-2 py-1.5"
        >
          {MODEL_KINDS.map((k) => (
            <option key={k} value={k}>
              {KIND_LABELS[k]}
            </option>
          ))}
        </select>
      </label>
      {(model.kind === 'black-scholes' || model.kind === 'merton') && (
        <Group title="Diffusion">
          <NumberField
            label="Volatility σ"
            value={model.sigma}
            scale={100}
            unit="%"
            step={0.5}
            error={err('sigma')}
            onChange={set('sigma')}
          />
        </Group>
      )}
      {hasHeston && (
        <Group title="Variance">
          <NumberField
            label="Initial variance v₀"
            value={model.v0}
            step={0.005}
            error={err('v0')}
            hint={`spot vol ${(100 * Math.sqrt(Math.max(model.v0, 0))).toFixed(1)}%`}
            onChange={set('v0')}
          />
          <NumberField
            label="Mean reversion κ"
            value={model.kappa}
            step={0.1}
            error={err('kappa')}
            onChange={set('kappa')}
          />
          <NumberField
            label="Long-run variance θ"
            value={model.theta}
            step={0.005}
            error={err('theta')}
            onChange={set('theta')}
          />
          <NumberField
            label="Vol of vol ξ"
            value={model.volOfVol}
            step={0.05}
            error={err('volOfVol')}
            onChange={set('volOfVol')}
          />
          <NumberField
            label="Correlation ρ"
            value={model.rho}
            step={0.05}
            error={err('rho')}
            onChange={set('rho')}
          />
          {feller !== null && (
            <p className="text-xs text-muted" data-testid="feller">
              Feller condition 2κθ ≥ ξ²: {feller >= 0 ? 'holds' : 'does not hold'} (
              {(2 * model.kappa * model.theta).toFixed(3)} vs {(model.volOfVol ** 2).toFixed(3)});
              shown, not enforced.
            </p>
          )}
        </Group>
      )}
      {(model.kind === 'merton' || model.kind === 'bates') && (
        <Group title="Jumps (lognormal)">
          <NumberField
            label="Intensity λ (per year)"
            value={model.jumpIntensity}
            step={0.1}
            error={err('jumpIntensity')}
            onChange={set('jumpIntensity')}
          />
          <NumberField
            label="Mean log-jump μJ"
            value={model.jumpMean}
            step={0.01}
            error={err('jumpMean')}
            onChange={set('jumpMean')}
          />
          <NumberField
            label="Jump spread σJ"
            value={model.jumpStdev}
            step={0.01}
            error={err('jumpStdev')}
            onChange={set('jumpStdev')}
          />
        </Group>
      )}
      {model.kind === 'heston-kou' && (
        <Group title="Jumps (double-exponential)">
          <NumberField
            label="Intensity λ (per year)"
            value={model.jumpIntensity}
            step={0.1}
            error={err('jumpIntensity')}
            onChange={set('jumpIntensity')}
          />
          <NumberField
            label="Up probability p"
            value={model.upProbability}
            step={0.05}
            error={err('upProbability')}
            onChange={set('upProbability')}
          />
          <NumberField
            label="Mean up log-jump"
            value={model.upMean}
            step={0.01}
            error={err('upMean')}
            onChange={set('upMean')}
          />
          <NumberField
            label="Mean down log-jump"
            value={model.downMean}
            step={0.01}
            error={err('downMean')}
            onChange={set('downMean')}
          />
        </Group>
      )}
    </div>
  );
}
