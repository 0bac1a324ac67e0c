import { memo } from 'react';
/**
 * The jump-intensity schedule on Sketch: rows of "until this date, λ per year", then the model's
 * own intensity, drawn as a step line against time.
 */
import {
  dateAfter,
  expiryYears,
  MAX_SCHEDULE_POINTS,
  type IntensitySchedule,
} from '../../../engine/core';
import { NumberField } from './NumberField';

interface Props {
  valuationDate: string;
  schedule: IntensitySchedule;
  /** the model's intensity, in force after the last point */
  baseIntensity: number;
  errors: Record<string, string>;
  onChange: (schedule: [number, number][]) => void;
}

const W = 280;
const H = 90;
const PAD = { l: 30, r: 8, t: 8, b: 18 };

/** λ against time as an SVG step line, with the last interval extended by a third. */
function ScheduleChart({ schedule, base }: { schedule: IntensitySchedule; base: number }) {
  const end = (schedule.at(-1)?.[0] ?? 0.1) * (4 / 3);
  const steps: [number, number, number][] = [];
  let start = 0;
  for (const [t, l] of schedule) {
    steps.push([start, t, l]);
    start = t;
  }
  steps.push([start, end, base]);
  const top = Math.max(...steps.map((s) => s[2]), 1e-9) * 1.15;
  const x = (t: number) => PAD.l + ((W - PAD.l - PAD.r) * t) / end;
  const y = (l: number) => PAD.t + (H - PAD.t - PAD.b) * (1 - l / top);
  const path = steps
    .map(([a, b, l], i) => `${i === 0 ? 'M' : 'L'}${x(a)},${y(l)} L${x(b)},${y(l)}`)
    .join(' ');
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="w-full"
      role="img"
      aria-label="Jump intensity against time"
    >
      <line x1={PAD.l} x2={W - PAD.r} y1={y(0)} y2={y(0)} className="stroke-rule" />
      <path d={path} fill="none" strokeWidth={2} className="stroke-stressed" />
      <text x={PAD.l - 4} y={y(top / 1.15) + 4} textAnchor="end" className="fill-muted text-[9px]">
        {(top / 1.15).toFixed(2)}
      </text>
      <text x={PAD.l - 4} y={y(0)} textAnchor="end" className="fill-muted text-[9px]">
        0
      </text>
      <text x={W - PAD.r} y={H - 4} textAnchor="end" className="fill-muted text-[9px]">
        {Math.round(end * 365)} days · λ per year
      </text>
    </svg>
  );
}

// memo: a stress step re-renders the page, not this
export const IntensitySchedulePanel = memo(function IntensitySchedulePanel({
  valuationDate,
  schedule,
  baseIntensity,
  errors,
  onChange,
}: Props) {
  const rows = schedule.map(([t, l]) => [t, l] as [number, number]);
  const set = (i: number, pair: [number, number]) =>
    onChange(rows.map((r, j) => (j === i ? pair : r)));
  const add = () => {
    const last = rows.at(-1)?.[0] ?? 0;
    onChange([...rows, [(Math.round(last * 365) + 14) / 365, baseIntensity * 2 || 1]]);
  };
  return (
    <fieldset className="space-y-2 border-t border-rule pt-3" data-testid="schedule-panel">
      <legend className="pr-2 text-xs font-semibold uppercase tracking-wide text-muted">
        Jump-intensity schedule
      </legend>
      <p className="text-xs text-muted">
        The jump intensity up to each date, then the model’s {baseIntensity.toFixed(2)} per year.
      </p>
      {rows.map(([t, l], i) => (
        <div
          key={i}
          className="grid grid-cols-[1fr_auto] items-end gap-2"
          data-testid="schedule-row"
        >
          <div className="space-y-1">
            <label className="flex items-center justify-between gap-2 text-sm">
              <span className="text-ink/85">Until</span>
              <input
                type="date"
                aria-label={`Schedule point ${i + 1} date`}
                value={dateAfter(valuationDate, t)}
                onChange={(e) => {
                  const y = expiryYears(e.target.value, valuationDate);
                  if (typeof y === 'number' && y > 0) set(i, [y, l]);
                }}
                className="rounded border border-rule bg-panel px-1 py-0.5"
              />
            </label>
            <NumberField
              label="Intensity λ (per year)"
              value={l}
              step={0.1}
              error={errors[`model.jumpIntensitySchedule.${i}.1`]}
              onChange={(v) => set(i, [t, v])}
            />
          </div>
          <button
            type="button"
            onClick={() => onChange(rows.filter((_, j) => j !== i))}
            aria-label={`Delete schedule point ${i + 1}`}
            className="rounded px-1.5 pb-1 text-sm text-muted hover:text-stressed"
          >
            ✕
          </button>
        </div>
      ))}
      {errors['model.jumpIntensitySchedule'] && (
        <p className="text-xs text-stressed">schedule: {errors['model.jumpIntensitySchedule']}</p>
      )}
      {rows.length > 0 && <ScheduleChart schedule={rows} base={baseIntensity} />}
      <button
        type="button"
        onClick={add}
        disabled={rows.length >= MAX_SCHEDULE_POINTS}
        className="rounded border border-rule px-2 py-0.5 text-sm hover:border-ink disabled:opacity-50"
      >
        Add a date
      </button>
    </fieldset>
  );
});
