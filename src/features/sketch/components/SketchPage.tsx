import { ReadOnlyNote } from './ReadOnlyNote';
import { useMemo, useState } from 'react';
import { CautionNote } from '../../../components/CautionNote';
import { formatTenor } from '../../../components/format';
import { DensityChart, type PointMass } from './DensityChart';
import { ExpiryPicker } from './ExpiryPicker';
import { StrikeSpacingChoice } from './StrikeSpacingChoice';
import { ModelForm } from './ModelForm';
import { AXIS_LABEL, SmileChart, type AxisMode } from './SmileChart';
import { SmileTable } from './SmileTable';
import { StressPanel } from './StressPanel';
import { markPainted } from '../painted-mark';
import { TermStructureChart } from './TermStructureChart';
import { EventsPanel } from './EventsPanel';
import { EventMovesTable } from './EventMovesTable';
import { IntensitySchedulePanel } from './IntensitySchedulePanel';
import {
  hasJumps,
  NO_STRESS,
  parameterValue,
  touches,
  twoPointOutcomes,
  type OptionSpec,
  type ScheduledMove,
  type Stress,
} from '../../../engine/core';
import { ScenarioPicker } from './ScenarioPicker';
import { TargetVols, type PickedPoint } from './TargetVols';
import type { TargetVol } from '../../../engine/fit';
import type { SmileResponse } from '../../../workers/engine-api';
import { SensitivityTable } from './SensitivityTable';
import { smileRequest, useGreeks, useSensitivities, useSmiles } from '../hooks/use-smiles';
import { useSettled } from '../hooks/use-settled';
import { useSketchScenario, type SaveState } from '../hooks/use-sketch-scenario';
import { useDocHandlers } from '../hooks/use-doc-handlers';

const NO_TARGETS: TargetVol[] = [];
const NO_SCHEDULE: [number, number][] = [];

const SAVE_LABEL: Record<SaveState, string> = {
  loading: 'Opening…',
  saved: 'Saved on this device',
  saving: 'Saving…',
  unsaved: 'Saving…',
  invalid: 'Not saved: fix the fields marked in red',
  error: 'Could not save',
};

/** The outcomes of the up-or-down moves that touch an expiry, for the density chart. */
function pointMassesAt(events: readonly ScheduledMove[], expiry: number): PointMass[] {
  return events.flatMap((e, i) => {
    if (e.law !== 'two-point' || !touches(e.time, expiry)) return [];
    const { up, down, p } = twoPointOutcomes(e);
    const name = e.name?.trim() || `Move ${i + 1}`;
    return [
      { x: up, label: `${name}: up, chance ${Math.round(100 * p)} %` },
      { x: down, label: `${name}: down, chance ${Math.round(100 * (1 - p))} %` },
    ];
  });
}

const NO_EVENTS: ScheduledMove[] = [];

/** The base side of two answers is the same: only the stress moved between them. */
const fingerprints = new WeakMap<SmileResponse, string>();
function baseFingerprint(r: SmileResponse): string {
  let f = fingerprints.get(r);
  if (f === undefined) {
    f = JSON.stringify([r.base.slices.map((s) => s.impliedVols), r.eventMoves, r.density?.base]);
    fingerprints.set(r, f);
  }
  return f;
}
const sameBase = (a: SmileResponse, b: SmileResponse) => baseFingerprint(a) === baseFingerprint(b);

export function SketchPage() {
  const { doc, update, saveState, issues, loadError } = useSketchScenario();
  const [axis, setAxis] = useState<AxisMode>('moneyness');
  const [tableExpiryIndex, setTableExpiryIndex] = useState(0);
  const errors = useMemo(
    () => Object.fromEntries(issues.map((i) => [i.path, i.message])),
    [issues],
  );
  const valid = doc !== null && issues.length === 0;
  const handlers = useDocHandlers(doc, update);
  const expiries = useMemo(() => doc?.grid.expiries ?? [], [doc]);
  const tableIndex = Math.min(tableExpiryIndex, Math.max(expiries.length - 1, 0));
  const request = useMemo(
    () => (valid && doc ? smileRequest(doc, expiries[tableIndex]) : null),
    [valid, doc, expiries, tableIndex],
  );
  // the same array while the moves are unchanged: a stress step must not redraw what hangs on them
  const modelEvents = doc?.model.events;
  const events = useMemo(() => modelEvents ?? NO_EVENTS, [modelEvents]);
  const pointMasses = useMemo(
    () => pointMassesAt(events, expiries[tableIndex] ?? 0),
    [events, expiries, tableIndex],
  );
  const eventMarkers = useMemo(
    () => events.map((e, i) => ({ time: e.time, label: e.name?.trim() || `Move ${i + 1}` })),
    [events],
  );
  const smiles = useSmiles(request);
  // the smile panels follow every step; the views beside them when the drag pauses
  const side = useSettled(smiles.data, sameBase);
  const slice = side?.base.slices[tableIndex] ?? null;
  const options = useMemo<OptionSpec[] | null>(
    () =>
      slice
        ? slice.strikes.map((strike, i) => ({
            type: slice.logMoneyness[i] < 0 ? 'put' : 'call',
            strike,
            expiry: slice.expiry,
          }))
        : null,
    [slice],
  );
  const greeks = useGreeks(
    valid && doc ? doc.market : null,
    valid && doc ? doc.model : null,
    options,
  );
  const sensitivities = useSensitivities(
    valid && doc ? doc.market : null,
    valid && doc ? doc.model : null,
    slice ? slice.expiry : null,
    slice ? slice.logMoneyness : null,
  );
  const [picked, setPicked] = useState<PickedPoint | null>(null);
  // the target entry starts two ATM standard deviations below the forward of the first expiry:
  // inside its panel, where quotes are
  const first = smiles.data?.base.slices[0];
  const defaultTargetK =
    first?.atm != null ? -Math.round(2 * first.atm * Math.sqrt(first.expiry) * 1e3) / 1e3 : -0.05;

  if (loadError && !doc)
    return (
      <p role="alert" className="text-stressed">
        {loadError}
      </p>
    );
  if (!doc) return <p className="text-muted">Opening the scenario…</p>;
  const stress: Stress = { ...NO_STRESS, ...(doc.stress ?? {}) };
  const targets = (Array.isArray(doc.targets) ? doc.targets : NO_TARGETS) as TargetVol[];
  const eventBaseVol = typeof doc.eventBaseVol === 'number' ? doc.eventBaseVol : undefined;

  return (
    // each block is its own layout container, and on the right its own paint container too: a
    // slider step re-lays and repaints the blocks it changes, not the page around them (the forms
    // keep their paint unclipped, for the focus rings at their edges)
    <div className="grid gap-6 lg:grid-cols-[20rem_1fr]">
      <aside className="min-w-0 space-y-4 [&>*]:[contain:layout_style]" aria-label="Scenario">
        <ScenarioPicker currentId={doc.id} />
        <div className="space-y-1">
          <input
            aria-label="Scenario name"
            value={doc.name}
            onChange={(e) => handlers.name(e.target.value)}
            className={`w-full rounded border bg-panel px-2 py-1 text-lg font-semibold ${errors.name ? 'border-stressed' : 'border-transparent hover:border-rule'}`}
          />
          <p className="text-xs text-muted" data-testid="save-state" data-state={saveState}>
            {SAVE_LABEL[saveState]} · valuation {doc.valuationDate}
          </p>
          {errors.name && <p className="text-xs text-stressed">name: {errors.name}</p>}
          <ReadOnlyNote scenarioId={doc.id} />
        </div>
        <StressPanel
          stress={stress}
          kind={doc.model.kind}
          hasEvents={events.length > 0}
          issues={smiles.data?.stressIssues ?? []}
          onChange={handlers.stress}
        />
        <ModelForm
          market={doc.market}
          model={doc.model}
          errors={errors}
          onMarket={handlers.market}
          onModel={handlers.model}
        />
        <EventsPanel
          valuationDate={doc.valuationDate}
          events={events}
          errors={errors}
          onChange={handlers.events}
        />
        {hasJumps(doc.model.kind) && (
          <IntensitySchedulePanel
            valuationDate={doc.valuationDate}
            schedule={doc.model.jumpIntensitySchedule ?? NO_SCHEDULE}
            baseIntensity={parameterValue(doc.model, 'jumpIntensity')}
            errors={errors}
            onChange={handlers.schedule}
          />
        )}
        <TargetVols
          getDoc={handlers.getDoc}
          expiries={expiries}
          kind={doc.model.kind}
          targets={targets}
          onTargets={handlers.targets}
          picked={picked}
          defaultK={defaultTargetK}
        />
      </aside>

      <section className="min-w-0 space-y-5 [&>*]:[contain:content]" aria-label="Smiles">
        <CautionNote />
        <div className="flex flex-wrap items-center justify-between gap-3">
          <ExpiryPicker expiries={expiries} onChange={handlers.expiries} />
          <StrikeSpacingChoice value={doc.grid.strikeSpacing} onChange={handlers.spacing} />
          <div role="radiogroup" aria-label="Horizontal axis" className="flex gap-1 text-sm">
            {(Object.keys(AXIS_LABEL) as AxisMode[]).map((m) => (
              <button
                key={m}
                type="button"
                role="radio"
                aria-checked={axis === m}
                onClick={() => setAxis(m)}
                className={`rounded px-2 py-0.5 ${axis === m ? 'bg-ink text-paper' : 'text-muted hover:text-ink'}`}
              >
                {m === 'strike' ? 'Strike' : m === 'moneyness' ? 'ln(K/F)' : 'Delta'}
              </button>
            ))}
          </div>
        </div>
        {!valid ? (
          <p role="alert" className="rounded border border-stressed/40 p-3 text-sm text-stressed">
            The smiles wait for valid inputs:{' '}
            {issues.map((i) => `${i.path} ${i.message}`).join('; ')}
          </p>
        ) : smiles.isError ? (
          <p role="alert" className="text-stressed">
            The engine failed: {(smiles.error as Error).message}
          </p>
        ) : !smiles.data ? (
          <p className="text-muted">Computing smiles…</p>
        ) : (
          <>
            <div data-testid="smile-chart" data-stressed={smiles.data.stressed ? 'yes' : 'no'}>
              <h2 className="sr-only">Implied volatility by {AXIS_LABEL[axis]}</h2>
              <SmileChart
                base={smiles.data.base}
                stressed={smiles.data.stressed}
                mode={axis}
                targets={targets}
                onPick={setPicked}
                onPainted={() =>
                  markPainted({
                    engineMs: smiles.data?.elapsedMs ?? 0,
                    stress: JSON.stringify(request?.stress ?? null),
                  })
                }
              />
              <p className="text-xs text-muted">
                {AXIS_LABEL[axis]} · implied vol in % · computed in{' '}
                {smiles.data.elapsedMs.toFixed(1)} ms · engine {smiles.data.engineVersion}
              </p>
            </div>
            <TermStructureChart
              base={side!.base}
              stressed={side!.stressed}
              term={side!.term}
              events={eventMarkers}
            />
            <EventMovesTable
              valuationDate={doc.valuationDate}
              events={events}
              estimates={side!.eventMoves}
              expiries={expiries}
              baseVol={eventBaseVol}
              onBaseVol={handlers.eventBaseVol}
            />
            <div className="space-y-2">
              <div className="flex items-center gap-3">
                <h2 className="text-lg font-semibold">Expiry detail</h2>
                <select
                  aria-label="Expiry for the table"
                  value={tableIndex}
                  onChange={(e) => setTableExpiryIndex(Number(e.target.value))}
                  className="rounded border border-rule bg-panel px-2 py-1 text-sm"
                >
                  {expiries.map((t, i) => (
                    <option key={t} value={i}>
                      {formatTenor(t)}
                    </option>
                  ))}
                </select>
              </div>
              {slice && (
                <SmileTable
                  slice={slice}
                  stressedSlice={side!.stressed?.slices[tableIndex] ?? null}
                  greeks={greeks.data?.results ?? null}
                  scenarioName={doc.name}
                />
              )}
              {sensitivities.data && slice && (
                <SensitivityTable
                  sensitivities={sensitivities.data}
                  logMoneyness={slice.logMoneyness}
                  model={doc.model}
                />
              )}
              {side!.density && (
                <DensityChart
                  density={side!.density!}
                  title={`Density of log-returns at ${formatTenor(expiries[tableIndex])}`}
                  pointMasses={pointMasses}
                />
              )}
            </div>
          </>
        )}
      </section>
    </div>
  );
}
