import { memo, useEffect, useRef, useState } from 'react';
import { type ModelKind, type ScenarioDocument, hasJumps } from '../../../engine/core';
import type { TargetVol } from '../../../engine/fit';
import { useTargetSolve } from '../hooks/use-target-solve';
import { formatTenor } from '../../../components/format';

/** A point picked on a smile panel: it fills the entry, whose vol the user then sets. */
export interface PickedPoint {
  expiry: number;
  logMoneyness: number;
  impliedVol: number;
}

interface Props {
  /** the scenario as it stands when a solve starts */
  getDoc: () => ScenarioDocument;
  expiries: readonly number[];
  kind: ModelKind;
  targets: TargetVol[];
  onTargets: (targets: TargetVol[]) => void;
  /** the last point clicked on a smile panel */
  picked: PickedPoint | null;
  /** where the entry starts: two ATM standard deviations below the forward of the first expiry */
  defaultK: number;
}

/** Target vols placed on the smiles, and the solve that turns them into a new stressed scenario. */
// memo: a stress step re-renders the page, not this (its props hold still)
export const TargetVols = memo(function TargetVols({
  getDoc,
  expiries,
  kind,
  targets,
  onTargets,
  picked,
  defaultK,
}: Props) {
  const [expiry, setExpiry] = useState(expiries[0]);
  const [k, setK] = useState<string | null>(null);
  const kText = k ?? String(defaultK);
  const [vol, setVol] = useState('');
  const volInput = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (!picked) return;
    setExpiry(picked.expiry);
    setK(String(Math.round(picked.logMoneyness * 1e4) / 1e4));
    setVol((100 * picked.impliedVol).toFixed(2));
    volInput.current?.focus();
    volInput.current?.select();
  }, [picked]);
  const [also, setAlso] = useState({ rho: false, v0: false });
  const solver = useTargetSolve();
  const { error, setError, progress } = solver;
  const withJumps = hasJumps(kind);

  const add = () => {
    const kk = Number(kText);
    const v = Number(vol) / 100;
    if (!Number.isFinite(kk) || Math.abs(kk) > 2)
      return setError('ln(K/F) must be a number between −2 and 2');
    if (!(v > 0 && v < 5)) return setError('the target vol must be between 0 and 500 %');
    setError(null);
    onTargets([
      ...targets.filter((t) => !(t.expiry === expiry && t.logMoneyness === kk)),
      { expiry, logMoneyness: kk, impliedVol: v },
    ]);
    setVol('');
  };

  const solve = () => void solver.solve(getDoc(), targets, also);

  return (
    <fieldset className="space-y-2 border-t border-rule pt-3" data-testid="target-vols">
      <legend className="text-xs font-semibold uppercase tracking-wide text-muted">
        Target vols
      </legend>
      {!withJumps && (
        <p className="text-xs text-muted">Choose a model with jumps to solve for them.</p>
      )}
      <p className="text-xs text-muted">
        Click a smile to pick its expiry and strike, or type them; then set the vol and Place.
      </p>
      <div className="grid grid-cols-[4.5rem_1fr_1fr_auto] items-end gap-1 text-xs">
        <select
          aria-label="Target expiry"
          value={expiry}
          onChange={(e) => setExpiry(Number(e.target.value))}
          className="w-full min-w-0 rounded border border-rule bg-panel px-1 py-1"
        >
          {expiries.map((t) => (
            <option key={t} value={t}>
              {formatTenor(t)}
            </option>
          ))}
        </select>
        <input
          aria-label="Target ln(K/F)"
          value={kText}
          onChange={(e) => setK(e.target.value)}
          className="tabular w-full min-w-0 rounded border border-rule bg-panel px-1 py-1 text-right"
          placeholder="ln(K/F)"
        />
        <input
          aria-label="Target vol %"
          ref={volInput}
          value={vol}
          onChange={(e) => setVol(e.target.value)}
          onKeyDown={(e) => e.key === 'Enter' && add()}
          className="tabular w-full min-w-0 rounded border border-rule bg-panel px-1 py-1 text-right"
          placeholder="vol %"
        />
        <button
          type="button"
          onClick={add}
          className="rounded border border-rule px-2 py-1 hover:border-teal"
        >
          Place
        </button>
      </div>
      {targets.length > 0 && (
        <ul className="tabular space-y-0.5 text-xs">
          {targets.map((t) => (
            <li key={`${t.expiry}-${t.logMoneyness}`} className="flex justify-between">
              <span>
                {formatTenor(t.expiry)} at ln(K/F) {t.logMoneyness.toFixed(3)}:{' '}
                {(100 * t.impliedVol).toFixed(2)} %
              </span>
              <button
                type="button"
                className="text-muted hover:text-stressed"
                onClick={() => onTargets(targets.filter((x) => x !== t))}
                aria-label="Remove target"
              >
                ×
              </button>
            </li>
          ))}
        </ul>
      )}
      <div className="flex items-center gap-3 text-xs">
        <label className="flex items-center gap-1">
          <input
            type="checkbox"
            checked={also.rho}
            onChange={(e) => setAlso({ ...also, rho: e.target.checked })}
          />{' '}
          also ρ
        </label>
        <label className="flex items-center gap-1">
          <input
            type="checkbox"
            checked={also.v0}
            onChange={(e) => setAlso({ ...also, v0: e.target.checked })}
          />{' '}
          also v₀
        </label>
        <button
          type="button"
          disabled={!withJumps || targets.length === 0 || progress !== null}
          onClick={solve}
          className="ml-auto rounded bg-teal px-3 py-1 font-semibold text-paper disabled:opacity-50"
        >
          Solve jumps
        </button>
      </div>
      {progress !== null && (
        <p className="text-xs text-muted" role="status">
          Solving… {Math.round(100 * progress)} %{' '}
          <button type="button" className="text-stressed" onClick={solver.cancel}>
            Cancel
          </button>
        </p>
      )}
      {error && (
        <p role="alert" className="text-xs text-stressed">
          {error}
        </p>
      )}
    </fieldset>
  );
});
