import { memo } from 'react';
import { naturalStep, type ParameterSensitivity } from '../../../engine/analytic';
import { formatNumber } from '../../../components/format';
import { isParameterKey, parameterLabel, type Model } from '../../../engine/core';

interface Props {
  sensitivities: ParameterSensitivity[];
  logMoneyness: number[];
  /** the model the sensitivities are of: the steps follow its values (√v₀, √θ) */
  model: Model;
}

/** Columns as fractions of the grid's half-width (on a ±0.3 grid: −0.2 … 0.2). */
const PICK = [-2 / 3, -1 / 3, -1 / 6, 0, 1 / 6, 1 / 3, 2 / 3];

/**
 * How much the implied vol moves, in vol points, for a step of each parameter a trader thinks
 * in (to first order: ∂σ/∂p × step), at a few moneyness points of one expiry.
 */
// memo: a slider step re-renders the page, not this (its inputs follow when the drag pauses)
export const SensitivityTable = memo(function SensitivityTable({
  sensitivities,
  logMoneyness,
  model,
}: Props) {
  const halfWidth = logMoneyness.reduce((m, k) => Math.max(m, Math.abs(k)), 0);
  const columns = PICK.map((fraction) => {
    const target = fraction * halfWidth;
    let best = 0;
    logMoneyness.forEach((k, i) => {
      if (Math.abs(k - target) < Math.abs(logMoneyness[best] - target)) best = i;
    });
    return best;
  }).filter((v, i, arr) => arr.indexOf(v) === i);
  return (
    <div className="overflow-auto rounded border border-rule">
      <table className="tabular w-full text-right text-sm" data-testid="sensitivity-table">
        <caption className="px-2 py-1.5 text-left text-xs text-muted">
          Change of implied vol, in vol points, for the step shown (first order, ∂σ/∂p × step), at
          ln(K/F) =
        </caption>
        <thead className="text-xs text-muted">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-normal">
              parameter
            </th>
            <th scope="col" className="px-2 py-1 text-left font-normal">
              step
            </th>
            {columns.map((i) => (
              <th key={i} scope="col" className="px-2 py-1 font-normal">
                {formatNumber(logMoneyness[i], 3)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {sensitivities.map((s) => {
            const value = isParameterKey(s.parameter)
              ? ((model as Record<string, unknown>)[s.parameter] as number)
              : 0;
            const { step, label } = naturalStep(s.parameter, value);
            return (
              <tr key={s.parameter} className="border-t border-rule/60">
                <th scope="row" className="px-2 py-1 text-left font-normal">
                  {isParameterKey(s.parameter) ? parameterLabel(s.parameter) : s.parameter}
                </th>
                <td className="px-2 py-1 text-left text-muted">{label}</td>
                {columns.map((i) => (
                  <td key={i} className="px-2 py-1">
                    {s.dVol[i] === null ? '—' : formatNumber(100 * (s.dVol[i] as number) * step, 2)}
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
});
