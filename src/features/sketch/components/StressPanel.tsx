import { useId } from 'react';
import { NO_STRESS, stressFieldsOf, type ModelKind, type Stress } from '../../../engine/core';

interface Control {
  key: keyof Stress;
  label: string;
  min: number;
  max: number;
  step: number;
  format: (v: number) => string;
  /** a line under the slider when its effect is not where one would look for it */
  note?: string;
}

const times = (v: number) => `×${v.toFixed(2)}`;
const CONTROLS: Control[] = [
  {
    key: 'jumpIntensityScale',
    label: 'Jump intensity',
    min: 0,
    max: 10,
    step: 0.05,
    format: times,
  },
  {
    key: 'jumpMeanShift',
    label: 'Mean jump shift',
    min: -0.3,
    max: 0.1,
    step: 0.005,
    format: (v) => `${v >= 0 ? '+' : ''}${(100 * v).toFixed(1)}%`,
  },
  { key: 'jumpStdevScale', label: 'Jump spread', min: 0, max: 4, step: 0.05, format: times },
  {
    key: 'spotShift',
    label: 'Spot gap',
    min: -0.3,
    max: 0.2,
    step: 0.005,
    format: (v) => `${v >= 0 ? '+' : ''}${(100 * v).toFixed(1)}%`,
    note: 'Moves spot and the forwards with it. The smile in ln(K/F) and in delta does not move: every model here scales with spot. Its effect shows in the strike view and on the Book’s gap ladder.',
  },
  { key: 'volOfVolScale', label: 'Vol of vol', min: 0, max: 4, step: 0.05, format: times },
  { key: 'v0Scale', label: 'Initial variance', min: 0, max: 6, step: 0.05, format: times },
  { key: 'eventSizeScale', label: 'Scheduled moves', min: 0, max: 4, step: 0.05, format: times },
  { key: 'varianceJumpScale', label: 'Variance jump', min: 0, max: 5, step: 0.05, format: times },
  {
    key: 'jumpCorrelationShift',
    label: 'Jump correlation shift',
    min: -1,
    max: 1,
    step: 0.05,
    format: (v) => `${v >= 0 ? '+' : ''}${v.toFixed(2)}`,
  },
];

interface Props {
  stress: Stress;
  /** the model kind: only the sliders that move its parameters are shown */
  kind: ModelKind;
  /** the scheduled-move slider shows only when the scenario has moves */
  hasEvents: boolean;
  onChange: (s: Stress) => void;
  issues: { path: string; message: string }[];
}

export function StressPanel({ stress, kind, hasEvents, onChange, issues }: Props) {
  const applies = new Set<string>(stressFieldsOf(kind));
  if (hasEvents) applies.add('eventSizeScale');
  const baseId = useId();
  return (
    <fieldset className="space-y-3 border-t border-rule pt-3" aria-describedby={`${baseId}-issues`}>
      <legend className="flex w-full items-center justify-between pr-2">
        <span className="text-xs font-semibold uppercase tracking-wide text-muted">Stress</span>
      </legend>
      {CONTROLS.filter((c) => applies.has(c.key)).map((c) => {
        const id = `${baseId}-${c.key}`;
        const value = stress[c.key];
        return (
          <div key={c.key} className="space-y-0.5">
            <label htmlFor={id} className="flex justify-between text-sm">
              <span>{c.label}</span>
              <span
                className={`tabular ${value !== NO_STRESS[c.key] ? 'font-semibold text-stressed' : 'text-muted'}`}
              >
                {c.format(value)}
              </span>
            </label>
            <input
              id={id}
              data-testid={`stress-${c.key}`}
              type="range"
              min={c.min}
              max={c.max}
              step={c.step}
              value={value}
              className="w-full accent-[rgb(var(--stressed))]"
              onChange={(e) => onChange({ ...stress, [c.key]: Number(e.target.value) })}
              aria-describedby={c.note ? `${id}-note` : undefined}
            />
            {c.note && (
              <p id={`${id}-note`} className="text-xs text-muted">
                {c.note}
              </p>
            )}
          </div>
        );
      })}
      <button
        type="button"
        className="text-sm text-teal underline-offset-2 hover:underline"
        onClick={() => onChange({ ...NO_STRESS })}
      >
        Clear stress
      </button>
      <div id={`${baseId}-issues`} aria-live="polite">
        {issues.map((i) => (
          <p key={i.path} role="alert" className="text-xs text-stressed">
            Stressed parameters out of range — {i.path}: {i.message}
          </p>
        ))}
      </div>
    </fieldset>
  );
}
