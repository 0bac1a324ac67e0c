import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { LadderChart } from './LadderChart';
import { PnlMatrix } from './PnlMatrix';
import { PositionsTable } from './PositionsTable';
import { PositionsUpload } from './PositionsUpload';
import { BookPanel } from './BookPanel';
import { JumpExposurePanel } from './JumpExposurePanel';
import { WingHedgePanel } from './WingHedgePanel';
import { CautionNote } from '../../../components/CautionNote';
import { formatNumber } from '../../../components/format';
import { DEFAULT_VOL_REACTION, type Position } from '../../../engine/book';
import type { StoredScenario } from '../../../store/db';
import { localScenariosQuery } from '../../../store/hooks';
import {
  DEFAULT_LADDER,
  localBooksQuery,
  useCreateBook,
  useRevaluation,
  useUpdateBook,
} from '../hooks/use-book';

/** A third of the premium the short options took in, to two significant figures (at least 1). */
function startingBudget(legs: { value: number }[], positions: Position[]): number {
  const received = legs.reduce(
    (a, l, i) => a + (positions[i]?.type !== 'underlying' && l.value < 0 ? -l.value : 0),
    0,
  );
  return Math.max(1, Number((received / 3).toPrecision(2)));
}

const today = () => new Date().toISOString().slice(0, 10);

/** A set may mix underlyings by mistake: say so when a scenario's spot is far from the base's. */
function UnderlyingWarning({
  scenarios,
  baseId,
}: {
  scenarios: StoredScenario[];
  baseId: string | null;
}) {
  const base = scenarios.find((s) => s.id === baseId) ?? scenarios[0];
  if (!base) return null;
  const odd = scenarios.filter(
    (s) => Math.abs(Math.log(s.document.market.spot / base.document.market.spot)) > Math.log(1.5),
  );
  if (odd.length === 0) return null;
  return (
    <p role="note" className="text-sm text-warn">
      {odd
        .map(
          (s) =>
            `${s.name} has spot ${formatNumber(s.document.market.spot, 2)} against the base's ${formatNumber(base.document.market.spot, 2)}`,
        )
        .join('; ')}{' '}
      — a different underlying? Its P&amp;L revalues this book at that spot.
    </p>
  );
}

export function BookPage() {
  const [params, setParams] = useSearchParams();
  const sets = useQuery(localBooksQuery);
  const scenarios = useQuery(localScenariosQuery);
  const create = useCreateBook();
  const update = useUpdateBook();
  const [selectedLeg, setSelectedLeg] = useState<string | null>(null);
  const [ladderScenario, setLadderScenario] = useState(0);
  const [volReaction, setVolReaction] = useState(DEFAULT_VOL_REACTION);
  const current = sets.data?.find((s) => s.id === params.get('set')) ?? sets.data?.[0];
  const result = useRevaluation(current, scenarios.data ?? [], DEFAULT_LADDER, volReaction);
  const setPositions = (positions: Position[]) =>
    current && update.mutate({ id: current.id, change: { positions } });
  const valuationDate =
    scenarios.data?.find((s) => s.id === current?.baseScenarioId)?.document.valuationDate ??
    today();

  if (sets.isPending || scenarios.isPending) return <p className="text-muted">Opening the book…</p>;
  const positions = (current?.positions ?? []) as Position[];
  const members = (scenarios.data ?? []).filter((s) => current?.scenarioIds.includes(s.id));
  const baseScenario = members.find((s) => s.id === current?.baseScenarioId) ?? members[0];
  const legIndex = positions.findIndex((p) => p.id === selectedLeg);
  const data = result.data;

  return (
    <div className="grid gap-6 lg:grid-cols-[20rem_1fr]">
      <aside aria-label="Set and scenarios">
        <BookPanel
          sets={sets.data ?? []}
          current={current}
          scenarios={scenarios.data ?? []}
          onPick={(id) => setParams({ set: id })}
          onCreate={async (name) => {
            const s = await create.mutateAsync({
              name,
              scenarioIds: (scenarios.data ?? []).map((x) => x.id),
            });
            setParams({ set: s.id });
          }}
          onMembers={(ids) =>
            current &&
            update.mutate({
              id: current.id,
              change: {
                scenarioIds: ids,
                baseScenarioId: ids.includes(current.baseScenarioId ?? '')
                  ? current.baseScenarioId
                  : (ids[0] ?? null),
              },
            })
          }
          onBase={(id) =>
            current && update.mutate({ id: current.id, change: { baseScenarioId: id } })
          }
        />
      </aside>
      <section className="min-w-0 space-y-5" aria-labelledby="book-title">
        <h1 id="book-title" className="text-2xl font-semibold">
          Book
        </h1>
        <CautionNote />
        {!current ? (
          <p className="text-muted">
            Create a scenario set on the left; its book of positions is kept with it on this device.
          </p>
        ) : (
          <>
            <PositionsUpload
              valuationDate={valuationDate}
              onAccept={(ps, mode) =>
                setPositions(
                  mode === 'replace'
                    ? ps
                    : [...positions.filter((p) => !ps.some((q) => q.id === p.id)), ...ps],
                )
              }
            />
            {positions.length === 0 ? (
              <p className="text-muted">No positions in this set yet.</p>
            ) : (
              <>
                {data && (
                  <p className="tabular text-sm" data-testid="book-total">
                    Base value {formatNumber(data.base.total.value, 2)} · delta{' '}
                    {formatNumber(data.base.total.delta, 2)} · gamma{' '}
                    {data.base.total.gamma.toExponential(3)} · vega{' '}
                    {formatNumber(data.base.total.vega, 2)} per vol point · theta{' '}
                    {formatNumber(data.base.total.theta, 2)} per day · {data.elapsedMs.toFixed(0)}{' '}
                    ms
                  </p>
                )}
                {data && (
                  <p className="tabular text-sm" data-testid="book-since-trade">
                    {data.sinceTrade.priced > 0
                      ? `P&L since trade ${formatNumber(data.sinceTrade.total, 2)} over the ${data.sinceTrade.priced} leg${data.sinceTrade.priced > 1 ? 's' : ''} with a trade price`
                      : 'No leg has a trade price: add a tradePrice column for the P&L since trade'}{' '}
                    · vega by expiry{' '}
                    {data.vegaByExpiry
                      .filter((b) => b.vega !== 0)
                      .map((b) => `${b.label} ${formatNumber(b.vega, 2)}`)
                      .join(', ') || 'none'}
                  </p>
                )}
                {result.isError && (
                  <p role="alert" className="text-stressed">
                    Revaluation failed: {(result.error as Error).message}
                  </p>
                )}
                <PositionsTable
                  positions={positions}
                  risks={data?.base.legs ?? null}
                  sinceTrade={data?.sinceTrade.legs ?? null}
                  selected={selectedLeg}
                  onSelect={setSelectedLeg}
                  onQuantity={(id, q) =>
                    setPositions(positions.map((p) => (p.id === id ? { ...p, quantity: q } : p)))
                  }
                  onRemove={(id) => setPositions(positions.filter((p) => p.id !== id))}
                />
                {data && data.scenarios.length > 0 && (
                  <>
                    <UnderlyingWarning
                      scenarios={(scenarios.data ?? []).filter((s) =>
                        current.scenarioIds.includes(s.id),
                      )}
                      baseId={current.baseScenarioId}
                    />
                    <PnlMatrix result={data} positions={positions} onSelect={setSelectedLeg} />
                    {legIndex >= 0 && (
                      <div
                        className="rounded border border-rule p-3 text-sm"
                        data-testid="leg-drilldown"
                      >
                        <h3 className="font-semibold">{positions[legIndex].id}</h3>
                        <p className="tabular text-muted">
                          base value {formatNumber(data.base.legs[legIndex].value, 2)} · P&amp;L by
                          scenario:{' '}
                          {data.scenarios
                            .map(
                              (s) =>
                                `${s.name} ${s.legPnl ? formatNumber(s.legPnl[legIndex], 2) : '—'}`,
                            )
                            .join(' · ')}
                        </p>
                      </div>
                    )}
                    <div className="space-y-2" data-testid="gap-ladder">
                      <div className="flex items-center gap-3">
                        <h3 className="font-semibold">Gap ladder</h3>
                        <select
                          aria-label="Scenario on the ladder"
                          value={ladderScenario}
                          onChange={(e) => setLadderScenario(Number(e.target.value))}
                          className="rounded border border-rule bg-panel px-2 py-1 text-sm"
                        >
                          {data.scenarios.map((s, i) => (
                            <option key={s.id} value={i}>
                              {s.name}
                            </option>
                          ))}
                        </select>
                      </div>
                      <label className="flex items-center gap-2 text-sm">
                        <span>Spot-vol reaction: ATM vol +</span>
                        <input
                          type="number"
                          aria-label="Vol points per 1 % fall"
                          min={0}
                          max={10}
                          step={0.1}
                          value={volReaction}
                          onChange={(e) => {
                            const v = Number(e.target.value);
                            if (Number.isFinite(v) && v >= 0 && v <= 10) setVolReaction(v);
                          }}
                          className="tabular w-16 rounded border border-rule bg-panel px-1 py-0.5 text-right"
                        />
                        <span>vol points per 1 % fall (and − as much per 1 % rise)</span>
                      </label>
                      <LadderChart
                        result={data}
                        scenarioIndex={Math.min(ladderScenario, data.scenarios.length - 1)}
                      />
                    </div>
                    <JumpExposurePanel result={data} />
                    {baseScenario && (
                      <WingHedgePanel
                        scenarioId={baseScenario.id}
                        market={baseScenario.document.market}
                        model={baseScenario.document.model}
                        positions={positions}
                        defaultBudget={startingBudget(data.base.legs, positions)}
                      />
                    )}
                  </>
                )}
              </>
            )}
          </>
        )}
      </section>
    </div>
  );
}
