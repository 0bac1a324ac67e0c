/** The Fit page's settings form (react-hook-form over the settings schema) and its two runs. */
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { modelLabel, modelShortLabel, parameterLabel, parametersOf } from '../../../engine/core';
import {
  DEFAULT_FIT_SETTINGS,
  FIT_KINDS,
  fitSettingsSchema,
  type FitSettings,
} from '../fit-settings';

interface Props {
  disabled: boolean;
  /** how many scheduled moves the source scenario has */
  eventCount: number;
  onFit: (settings: FitSettings) => void;
  onVerdict: (settings: FitSettings) => void;
}

const heading = 'text-xs font-semibold uppercase tracking-wide text-muted';
const select = 'rounded border border-rule bg-panel px-2 py-1.5';

export function FitSettingsForm({ disabled, eventCount, onFit, onVerdict }: Props) {
  const {
    register,
    handleSubmit,
    watch,
    formState: { errors },
  } = useForm<FitSettings>({
    resolver: zodResolver(fitSettingsSchema),
    defaultValues: DEFAULT_FIT_SETTINGS,
  });
  const kind = watch('kind');
  return (
    <form className="space-y-4" onSubmit={handleSubmit(onFit)}>
      <label className="flex flex-col gap-1 text-sm">
        <span className={heading}>Model</span>
        <select aria-label="Model to fit" className={select} {...register('kind')}>
          {FIT_KINDS.map((k) => (
            <option key={k} value={k}>
              {modelLabel(k)}
            </option>
          ))}
        </select>
      </label>
      <fieldset className="space-y-1 text-sm">
        <legend className={heading}>Hold fixed</legend>
        <div className="flex flex-wrap gap-x-3">
          {parametersOf(kind).map((p) => (
            <label key={p} className="flex items-center gap-1">
              <input type="checkbox" value={p} {...register('fixed')} /> {parameterLabel(p)}
            </label>
          ))}
        </div>
      </fieldset>
      {eventCount > 0 && (
        <label className="flex items-center gap-1 text-sm">
          <input type="checkbox" {...register('fitEventSizes')} /> Fit the sizes of the
          scenario&apos;s {eventCount} scheduled move{eventCount > 1 ? 's' : ''} too
        </label>
      )}
      <label className="flex flex-col gap-1 text-sm">
        <span className={heading}>Weights</span>
        <select className={select} {...register('weights')}>
          <option value="uniform">uniform (bid-ask spread if given)</option>
          <option value="vega">vega (the wings count less)</option>
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm">
        <span className={heading}>Anchor to the last fit in the history</span>
        <input
          type="number"
          min={0}
          step={10}
          aria-label="Anchor weight"
          className={select}
          {...register('anchorWeight', { valueAsNumber: true })}
        />
        <span className="text-xs text-muted">
          {errors.anchorWeight
            ? errors.anchorWeight.message
            : '0: a free fit; larger: today’s parameters stay nearer the last saved fit'}
        </span>
      </label>
      <label className="flex flex-col gap-1 text-sm">
        <span className={heading}>Comparison: one scheduled move on</span>
        <input
          type="date"
          aria-label="Scheduled move date for the comparison"
          className={select}
          {...register('moveDate')}
        />
        <span className="text-xs text-muted">
          {errors.moveDate
            ? 'must be a real date'
            : 'optional: Heston with one dated move of fitted size, beside Heston and Bates'}
        </span>
      </label>
      <div className="flex flex-wrap gap-2">
        <button
          type="submit"
          disabled={disabled}
          className="rounded bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-50"
        >
          Fit {modelShortLabel(kind)}
        </button>
        <button
          type="button"
          disabled={disabled}
          onClick={handleSubmit(onVerdict)}
          className="rounded border border-teal px-4 py-1.5 text-teal disabled:opacity-50"
        >
          Compare Heston and Bates
        </button>
      </div>
    </form>
  );
}
