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
import { BookTotals } from './BookTotals';
import { DeskBookStatus } from './DeskBookStatus';
import { CautionNote } from '../../../components/CautionNote';
import { formatNumber } from '../../../components/format';
import { DEFAULT_VOL_REACTION, type Position } from '../../../engine/book';
import { localScenariosQuery } from '../../../store/hooks';
import { DEFAULT_LADDER, useRevaluation } from '../hooks/use-book';
import {
  useBooks,
  useChangeBook,
  useCreateBook,
  useResolveBook,
  type BookChange,
} from '../hooks/use-book-source';

/** A third of the premium the short options took in, to two significant figures (at least 1). */
function startingBudget(legs: { value: number }[], positions: Position[]): number {
  const received = legs.reduce(
    (a, l, i) => a + (positions[i]?.type !== 'underlying' && l.value < 0 ? -l.value : 0),
    0,
  );
  return Math.max(1, Number((received / 3).toPrecision(2)));
}

const today = () => new Date().toISOString().slice(0, 10);

export function BookPage() {
  const [params, setParams] = useSearchParams();
  const { books, writableSets, isPending } = useBooks();
  const scenarios = useQuery(localScenariosQuery);
  const create = useCreateBook();
  const change = useChangeBook();
  const resolve = useResolveBook();
  const [selectedLeg, setSelectedLeg] = useState<string | null>(null);
  const [ladderScenario, setLadderScenario] = useState(0);
  const [volReaction, setVolReaction] = useState(DEFAULT_VOL_REACTION);
  // ?book=device:<id> | desk:<id>; ?set=<id> is the older link to a device book
  const wanted = params.get('book') ?? `device:${params.get('set') ?? ''}`;
  const current = books.find((b) => b.key === wanted) ?? books[0];
  const { revaluation: result, exposure } = useRevaluation(
    current,
    scenarios.data ?? [],
    DEFAULT_LADDER,
    volReaction,
  );
  const update = (c: BookChange) => current && change.mutate({ book: current, change: c });
  const setPositions = (positions: Position[]) => update({ positions });
  const valuationDate =
    scenarios.data?.find((s) => s.id === current?.baseScenarioId)?.document.valuationDate ??
    today();

  if (isPending || scenarios.isPending) return <p className="text-muted">Opening the book…</p>;
  const positions = current?.positions ?? [];
  // a desk book is revalued under its own set's scenarios; a device book under any on the device
  const candidates = (scenarios.data ?? []).filter((s) =>
    current?.set ? s.setId === current.set.id : true,
  );
  const members = candidates.filter((s) => current?.scenarioIds.includes(s.id));
  const baseScenario = members.find((s) => s.id === current?.baseScenarioId) ?? members[0];
  const legIndex = positions.findIndex((p) => p.id === selectedLeg);
  const data = result.data;

  return (
    <div className="grid gap-6 lg:grid-cols-[20rem_1fr]">
      <aside aria-label="Book and scenarios">
        <BookPanel
          books={books}
          current={current}
          candidates={candidates}
          writableSets={writableSets}
          onPick={(key) => setParams({ book: key })}
          onCreate={async (name, setId) => {
            const all = scenarios.data ?? [];
            const key = await create.mutateAsync({
              name,
              setId,
              scenarioIds: all.filter((x) => setId === null || x.setId === setId).map((x) => x.id),
            });
            setParams({ book: key });
          }}
          onMembers={(ids) =>
            current &&
            update({
              scenarioIds: ids,
              baseScenarioId: ids.includes(current.baseScenarioId ?? '')
                ? current.baseScenarioId
                : (ids[0] ?? null),
            })
          }
          onBase={(id) => update({ baseScenarioId: id })}
        />
      </aside>
      <section className="min-w-0 space-y-5" aria-labelledby="book-title">
        <h1 id="book-title" className="text-2xl font-semibold">
          Book
        </h1>
        <CautionNote />
        {change.isError && (
          <p role="alert" className="text-stressed">
            {(change.error as Error).message}
          </p>
        )}
        {!current ? (
          <p className="text-muted">
            Create a book on the left: on this device only, or in one of the desk&apos;s sets, where
            colleagues see it.
          </p>
        ) : (
          <>
            <DeskBookStatus
              book={current}
              resolving={resolve.isPending}
              onResolve={(how) => resolve.mutate({ book: current, how })}
            />
            {current.editable && (
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
            )}
            {positions.length === 0 ? (
              <p className="text-muted">No positions in this book yet.</p>
            ) : (
              <>
                {data && <BookTotals data={data} />}
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
                  readOnly={!current.editable}
                />
                {data && data.scenarios.length > 0 && (
                  <>
                    {data.scenarios
                      .filter((s) => s.issues.some((x) => x.path === 'market.underlying'))
                      .map((s) => (
                        <p key={s.id} role="note" className="text-sm text-warn">
                          {s.name} {s.issues[0].message}.
                        </p>
                      ))}
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
                    <JumpExposurePanel
                      result={data}
                      exposure={exposure.data}
                      error={exposure.error}
                    />
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
