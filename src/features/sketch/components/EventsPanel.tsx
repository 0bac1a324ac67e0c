/**
 * Scheduled moves on Sketch: add, date, size and delete the dated moves of ln S (results day,
 * a policy decision), each with its law. Dates are entered as calendar dates and stored as
 * years (ACT/365) from the valuation date.
 */
import { useId, memo } from 'react';
import { dateAfter, expiryYears, MAX_EVENTS, type ScheduledMove } from '../../../engine/core';
import { NumberField } from './NumberField';

interface Props {
  valuationDate: string;
  events: readonly ScheduledMove[];
  errors: Record<string, string>;
  onChange: (events: ScheduledMove[]) => void;
}

const NEW_MOVE_DAYS = 7;

function withLaw(e: ScheduledMove, law: ScheduledMove['law']): ScheduledMove {
  const common = { time: e.time, ...(e.name !== undefined ? { name: e.name } : {}) };
  return law === 'normal'
    ? { ...common, law, stdev: 0.03 }
    : { ...common, law, up: 0.04, down: -0.05, upProbability: 0.5 };
}

function MoveRow({
  index,
  move,
  valuationDate,
  errors,
  onMove,
  onDelete,
}: {
  index: number;
  move: ScheduledMove;
  valuationDate: string;
  errors: Record<string, string>;
  onMove: (e: ScheduledMove) => void;
  onDelete: () => void;
}) {
  const id = useId();
  const path = `model.events.${index}`;
  const set = (key: string) => (v: number) => onMove({ ...move, [key]: v } as ScheduledMove);
  const fieldErrors = Object.entries(errors).filter(([p]) => p.startsWith(`${path}.`));
  return (
    <li className="space-y-1.5 rounded border border-rule p-2" data-testid="event-row">
      <div className="flex items-center gap-2">
        <input
          aria-label={`Move ${index + 1} name`}
          value={move.name ?? ''}
          placeholder={`Move ${index + 1}`}
          maxLength={80}
          onChange={(e) => onMove({ ...move, name: e.target.value })}
          className="min-w-0 flex-1 rounded border border-rule bg-panel px-2 py-0.5 text-sm"
        />
        <button
          type="button"
          onClick={onDelete}
          aria-label={`Delete move ${index + 1}`}
          className="rounded px-1.5 text-sm text-muted hover:text-stressed"
        >
          ✕
        </button>
      </div>
      <div className="grid grid-cols-2 gap-2 text-sm">
        <label htmlFor={`${id}-date`} className="space-y-0.5">
          <span className="block text-xs text-muted">Date</span>
          <input
            id={`${id}-date`}
            type="date"
            value={dateAfter(valuationDate, move.time)}
            min={dateAfter(valuationDate, 1 / 365)}
            onChange={(e) => {
              const t = expiryYears(e.target.value, valuationDate);
              if (typeof t === 'number' && t > 0) onMove({ ...move, time: t });
            }}
            className="w-full rounded border border-rule bg-panel px-1 py-0.5"
          />
        </label>
        <label htmlFor={`${id}-law`} className="space-y-0.5">
          <span className="block text-xs text-muted">Law</span>
          <select
            id={`${id}-law`}
            value={move.law}
            onChange={(e) => onMove(withLaw(move, e.target.value as ScheduledMove['law']))}
            className="w-full rounded border border-rule bg-panel px-1 py-0.5"
          >
            <option value="normal">normal</option>
            <option value="two-point">up or down</option>
          </select>
        </label>
      </div>
      {move.law === 'normal' ? (
        <NumberField
          label="Move s.d."
          value={move.stdev}
          scale={100}
          unit="%"
          step={0.25}
          error={errors[`${path}.stdev`]}
          onChange={set('stdev')}
        />
      ) : (
        <>
          <NumberField
            label="Up move"
            value={move.up}
            scale={100}
            unit="%"
            step={0.25}
            error={errors[`${path}.up`]}
            onChange={set('up')}
          />
          <NumberField
            label="Down move"
            value={move.down}
            scale={100}
            unit="%"
            step={0.25}
            error={errors[`${path}.down`]}
            onChange={set('down')}
          />
          <NumberField
            label="Chance of up"
            value={move.upProbability}
            scale={100}
            unit="%"
            step={5}
            error={errors[`${path}.upProbability`]}
            onChange={set('upProbability')}
          />
        </>
      )}
      {fieldErrors
        .filter(([p]) => p === `${path}.time`)
        .map(([, m]) => (
          <p key="time" className="text-xs text-stressed">
            date: {m}
          </p>
        ))}
    </li>
  );
}

// memo: a stress step re-renders the page, not this
export const EventsPanel = memo(function EventsPanel({
  valuationDate,
  events,
  errors,
  onChange,
}: Props) {
  const add = () => {
    const last = events.length ? Math.max(...events.map((e) => e.time)) : 0;
    const time = (Math.round(last * 365) + NEW_MOVE_DAYS) / 365;
    onChange([...events, { time, law: 'normal', stdev: 0.03, name: '' }]);
  };
  return (
    <fieldset className="space-y-2 border-t border-rule pt-3" data-testid="events-panel">
      <legend className="pr-2 text-xs font-semibold uppercase tracking-wide text-muted">
        Scheduled moves
      </legend>
      <p className="text-xs text-muted">
        A dated move of the price (results, a rate decision), independent of the rest and priced
        into every expiry after its date. “Up or down” moves by one of two sizes.
      </p>
      {events.length > 0 && (
        <ol className="space-y-2">
          {events.map((e, i) => (
            <MoveRow
              key={i}
              index={i}
              move={e}
              valuationDate={valuationDate}
              errors={errors}
              onMove={(m) => onChange(events.map((x, j) => (j === i ? m : x)))}
              onDelete={() => onChange(events.filter((_, j) => j !== i))}
            />
          ))}
        </ol>
      )}
      {errors['model.events'] && (
        <p className="text-xs text-stressed">moves: {errors['model.events']}</p>
      )}
      <button
        type="button"
        onClick={add}
        disabled={events.length >= MAX_EVENTS}
        className="rounded border border-rule px-2 py-0.5 text-sm hover:border-ink disabled:opacity-50"
      >
        Add a move
      </button>
    </fieldset>
  );
});
