import { memo } from 'react';
/**
 * What the smiles say about each scheduled move: its size in the model, the move the ATM term
 * structure prices for it (forward-variance arithmetic against a base vol), and which of the
 * grid's expiries straddle it.
 */
import type { EventMoveEstimate } from '../../../engine/analytic';
import { dateAfter, moveVariance, touches, type ScheduledMove } from '../../../engine/core';
import { formatTenor, formatVol } from '../../../components/format';
import { NumberField } from './NumberField';

interface Props {
  valuationDate: string;
  events: readonly ScheduledMove[];
  estimates: readonly EventMoveEstimate[];
  expiries: readonly number[];
  /** the user's base vol for the implied moves, or undefined for the ATM vol before each move */
  baseVol: number | undefined;
  onBaseVol: (v: number | undefined) => void;
}

const moveName = (e: ScheduledMove, i: number) => e.name?.trim() || `Move ${i + 1}`;

function lawText(e: ScheduledMove): string {
  if (e.law === 'normal') return `normal, s.d. ${formatVol(e.stdev, 1)} %`;
  return `+${formatVol(e.up, 1)} % (${Math.round(100 * e.upProbability)} %) or ${formatVol(e.down, 1)} %`;
}

// memo: a stress step re-renders the page, not this
export const EventMovesTable = memo(function EventMovesTable({
  valuationDate,
  events,
  estimates,
  expiries,
  baseVol,
  onBaseVol,
}: Props) {
  if (events.length === 0) return null;
  const straddling = expiries
    .map((T) => ({
      T,
      moves: events.map((e, i) => ({ e, i })).filter(({ e }) => touches(e.time, T)),
    }))
    .filter((x) => x.moves.length > 0);
  return (
    <div className="space-y-2" data-testid="event-moves">
      <h2 className="text-lg font-semibold">Scheduled moves in the term structure</h2>
      <table className="tabular w-full text-sm">
        <thead className="text-left text-xs text-muted">
          <tr>
            <th className="py-1 pr-2 font-normal">Move</th>
            <th className="pr-2 font-normal">Date</th>
            <th className="pr-2 font-normal">Law</th>
            <th className="pr-2 text-right font-normal">Model s.d. (%)</th>
            <th className="pr-2 text-right font-normal">Implied by ATM vols (%)</th>
            <th className="text-right font-normal">Base vol (%)</th>
          </tr>
        </thead>
        <tbody>
          {events.map((e, i) => {
            const est = estimates.find((x) => x.time === e.time);
            return (
              <tr key={i} className="border-t border-rule">
                <td className="py-1 pr-2">{moveName(e, i)}</td>
                <td className="pr-2">{dateAfter(valuationDate, e.time)}</td>
                <td className="pr-2">{lawText(e)}</td>
                <td className="pr-2 text-right">{formatVol(Math.sqrt(moveVariance(e)), 2)}</td>
                <td className="pr-2 text-right" data-testid="implied-move">
                  {est ? formatVol(est.impliedMove, 2) : '—'}
                </td>
                <td className="text-right">{est ? formatVol(est.baseVol, 2) : '—'}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <div className="max-w-sm">
        <NumberField
          label="Base vol for implied moves"
          value={baseVol ?? 0}
          scale={100}
          unit="%"
          step={0.5}
          hint={baseVol === undefined ? 'blank or 0: the ATM vol just before each move' : undefined}
          onChange={(v) => onBaseVol(v > 0 ? v : undefined)}
        />
      </div>
      <p className="text-xs text-muted">
        Implied move σₑ² = σ₂²T₂ − σ₁²T₁ − σ_base²(T₂ − T₁), from the ATM vols just before and one
        day after the move (common practice: forward-variance arithmetic). The base vol is your
        choice; by default it is the ATM vol before the move.
      </p>
      {straddling.length > 0 && (
        <ul className="text-sm" data-testid="straddling-expiries">
          {straddling.map(({ T, moves }) => (
            <li key={T}>
              <span className="font-semibold">{formatTenor(T)}</span> includes{' '}
              {moves
                .map(
                  ({ e, i }) =>
                    `${moveName(e, i)} (±${formatVol(Math.sqrt(moveVariance(e)), 1)} %)`,
                )
                .join(', ')}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
});
