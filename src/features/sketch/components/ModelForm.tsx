import { memo, type ReactNode } from 'react';
import {
  convertModel,
  jumpSummary,
  modelEntry,
  modelSpec,
  validateModel,
  modelLabel,
  MODEL_KINDS,
  parameterLabel,
  parameterValue,
  PARAMETER_SPECS,
  type Market,
  type Model,
  type ModelKind,
  type ParameterKey,
  type ParameterSpec,
} from '../../../engine/core';
import { NumberField } from './NumberField';

/** What a field says under itself, where a raw value needs reading. */
const HINTS: Partial<Record<ParameterKey, (x: number) => string>> = {
  v0: (x) => `spot vol ${(100 * Math.sqrt(Math.max(x, 0))).toFixed(1)}%`,
};

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

function FellerNote({ model }: { model: Model }) {
  const [kappa, theta, xi] = (['kappa', 'theta', 'volOfVol'] as const).map((k) =>
    parameterValue(model, k),
  );
  const margin = 2 * kappa * theta - xi ** 2;
  return (
    <p className="text-xs text-muted" data-testid="feller">
      Feller condition 2κθ ≥ ξ²: {margin >= 0 ? 'holds' : 'does not hold'} (
      {(2 * kappa * theta).toFixed(3)} vs {(xi ** 2).toFixed(3)}); shown, not enforced.
    </p>
  );
}

/**
 * The jump law in plain words: how often, the mean move, the share upward (flagged when large
 * for an index), and for SVCJ how far one jump lifts the ATM vol from today's variance.
 */
function JumpLawNote({ model }: { model: Model }) {
  if (validateModel(model).length > 0) return null;
  const summary = jumpSummary(modelSpec(model).jumps);
  if (!summary) return <p className="text-xs text-muted">No jumps at zero intensity.</p>;
  const years = summary.yearsBetween;
  const every = years >= 1 ? `${years.toFixed(1)} years` : `${(years * 365).toFixed(0)} days`;
  const v0 = typeof model.v0 === 'number' ? model.v0 : null;
  return (
    <div className="space-y-0.5 text-xs text-muted" data-testid="jump-law-note">
      <p>
        A jump every {every} on average, mean move {(100 * summary.meanMove).toFixed(1)} %,{' '}
        {(100 * summary.upShare).toFixed(0)} % of jumps upward.
      </p>
      {summary.upShare > 0.4 && (
        <p className="text-stressed">
          That many upward jumps is unusual for an equity index, whose jumps are mostly falls.
        </p>
      )}
      {summary.varianceJump !== undefined && v0 !== null && (
        <p>
          Each jump adds {summary.varianceJump.toFixed(3)} to the variance on average: spot vol{' '}
          {(100 * Math.sqrt(v0)).toFixed(1)} % becomes{' '}
          {(100 * Math.sqrt(v0 + summary.varianceJump)).toFixed(1)} % after a typical jump.
        </p>
      )}
    </div>
  );
}

// memo: a stress step re-renders the page, not this
export const ModelForm = memo(function ModelForm({
  market,
  model,
  errors,
  onMarket,
  onModel,
}: Props) {
  const set = (key: string) => (v: number) => onModel({ ...model, [key]: v } as Model);
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
              {modelLabel(k)}
            </option>
          ))}
        </select>
      </label>
      {modelEntry(model.kind).groups.map((group) => (
        <Group key={group.title} title={group.title}>
          {group.parameters.map((key) => {
            const spec: ParameterSpec = PARAMETER_SPECS[key];
            const value = parameterValue(model, key);
            return (
              <NumberField
                key={key}
                label={parameterLabel(key)}
                value={value}
                step={spec.step}
                scale={spec.display?.scale}
                unit={spec.display?.unit}
                hint={HINTS[key]?.(value)}
                error={errors[`model.${key}`]}
                onChange={set(key)}
              />
            );
          })}
          {group.role === 'variance' && <FellerNote model={model} />}
          {group.role === 'jumps' && <JumpLawNote model={model} />}
        </Group>
      ))}
    </div>
  );
});
