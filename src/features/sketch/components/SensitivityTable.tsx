import type { ParameterSensitivity } from '../../../engine/analytic';
import { isParameterKey, parameterLabel } from '../../../engine/core';

interface Props {
  sensitivities: ParameterSensitivity[];
  logMoneyness: number[];
}

const PICK = [-0.2, -0.1, -0.05, 0, 0.05, 0.1, 0.2];

/** ∂σ/∂p in vol points per unit of each parameter, at a few moneyness points of one expiry. */
export function SensitivityTable({ sensitivities, logMoneyness }: Props) {
  const columns = PICK.map((target) => {
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
          Smile sensitivity ∂σ/∂p, in vol points per unit of each parameter, at ln(K/F) =
        </caption>
        <thead className="text-xs text-muted">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-normal">
              parameter
            </th>
            {columns.map((i) => (
              <th key={i} scope="col" className="px-2 py-1 font-normal">
                {logMoneyness[i].toFixed(2)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {sensitivities.map((s) => (
            <tr key={s.parameter} className="border-t border-rule/60">
              <th scope="row" className="px-2 py-1 text-left font-normal">
                {isParameterKey(s.parameter) ? parameterLabel(s.parameter) : s.parameter}
              </th>
              {columns.map((i) => (
                <td key={i} className="px-2 py-1">
                  {s.dVol[i] === null ? '—' : (100 * (s.dVol[i] as number)).toFixed(2)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
