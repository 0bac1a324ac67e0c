/**
 * The wing-hedge suggestion: the user picks 2–4 put strikes, 1–2 expiries, a premium budget and
 * the measure (the replay's ES99 on a pilot run, or the worst ladder loss from −30 % to −5 %);
 * the engine finds how many of each put to buy, and the page shows the premium, the ladder
 * before and after, and hands the position with that overlay to Replay on the same seed.
 */
import type { Data, Layout } from 'plotly.js';
import { useMemo, useState } from 'react';
import { useNavigate } from 'react-router';
import { wingHedgeSchema, type Position } from '../../../engine/book';
import { MAX_REPLAY_YEARS } from '../../../engine/replay';
import type { Market, Model } from '../../../engine/core';
import { chartFrame, chartTheme, legendRow } from '../../../components/chart-theme';
import { formatNumber } from '../../../components/format';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';
import { handToReplay } from '../../../store/replay-handover';
import {
  PILOT_PATHS,
  replayLegs,
  useWingHedge,
  type WingAnswer as Answer,
  type WingObjective,
} from '../hooks/use-wing-hedge';

const input = 'tabular w-40 rounded border border-rule bg-panel px-2 py-1 text-right';
const numbers = (s: string) =>
  s
    .split(/[,\s]+/)
    .filter((x) => x !== '')
    .map(Number);

export function WingHedgePanel({
  scenarioId,
  market,
  model,
  positions,
  defaultBudget,
}: {
  scenarioId: string;
  market: Market;
  model: Model;
  positions: Position[];
  /** where the budget starts: a share of the premium the book's short options took in */
  defaultBudget: number;
}) {
  const spot = market.spot;
  const [strikes, setStrikes] = useState(() =>
    [0.9, 0.93, 0.96].map((f) => String(Math.round(f * spot * 100) / 100)).join(', '),
  );
  const [objective, setObjective] = useState<WingObjective>('pilot');
  const [seed, setSeed] = useState('20261202');
  const [days, setDays] = useState('30');
  // the default follows the book until the user types a budget
  const [typedBudget, setBudget] = useState<string | null>(null);
  const budget = typedBudget ?? String(defaultBudget);
  const [problem, setProblem] = useState<string | null>(null);
  const navigate = useNavigate();
  const suggest = useWingHedge(market, model, positions);
  const ask = () => {
    const ks = numbers(strikes);
    const ts = numbers(days);
    if (ks.length < 2 || ks.length > 4) return setProblem('Strikes: give 2 to 4 put strikes.');
    if (ts.length < 1 || ts.length > 2) return setProblem('Expiries: give 1 or 2, in days.');
    const parsed = wingHedgeSchema.safeParse({
      instruments: ts.flatMap((d) => ks.map((k) => ({ type: 'put', strike: k, expiry: d / 365 }))),
      budget: Number(budget),
    });
    const seedValue = Number(seed);
    if (!Number.isSafeInteger(seedValue) || seedValue < 0)
      return setProblem('Seed: must be a whole number from 0.');
    if (!parsed.success) {
      const i = parsed.error.issues[0];
      const field =
        i.path[0] === 'budget' ? 'Budget' : i.path.includes('strike') ? 'Strikes' : 'Expiries';
      return setProblem(`${field}: ${i.message}.`);
    }
    setProblem(null);
    suggest.mutate({ objective, wingHedge: parsed.data, seed: seedValue });
  };
  const answer = suggest.data;
  const replayable = replayLegs(positions);
  const tooLong = replayable.some((p) => p.expiry > MAX_REPLAY_YEARS);
  const replay = () => {
    if (!answer) return;
    handToReplay({
      scenarioId,
      legs: replayable,
      overlay: answer.ask.wingHedge.instruments
        .map((o, j) => ({ ...o, quantity: answer.ladder.quantities[j] }))
        .filter((o) => o.quantity > 0),
      seed: answer.ask.seed,
    });
    void navigate('/replay?handover=1');
  };
  return (
    <section className="space-y-3" data-testid="wing-hedge" aria-labelledby="wing-hedge-title">
      <h3 id="wing-hedge-title" className="font-semibold">
        Wing hedge
      </h3>
      <p className="text-sm text-muted">
        Puts to buy, for at most the budget, so that the chosen loss measure of the book under the
        base model is as small as it can be: a linear programme; quantities may be fractional.
      </p>
      <form
        className="flex flex-wrap items-end gap-3 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          ask();
        }}
      >
        <label className="flex flex-col gap-1">
          Measure
          <select
            aria-label="Wing hedge measure"
            value={objective}
            onChange={(e) => setObjective(e.target.value as WingObjective)}
            className="rounded border border-rule bg-panel px-2 py-1"
          >
            <option value="pilot">
              replay ES99, {PILOT_PATHS.toLocaleString()}-path pilot (model delta, daily)
            </option>
            <option value="ladder">worst ladder loss, −30 % to −5 %</option>
          </select>
        </label>
        {objective === 'pilot' && (
          <label className="flex flex-col gap-1">
            Seed
            <input
              aria-label="Wing pilot seed"
              className="tabular w-28 rounded border border-rule bg-panel px-2 py-1 text-right"
              value={seed}
              onChange={(e) => setSeed(e.target.value)}
            />
          </label>
        )}
        <label className="flex flex-col gap-1">
          Put strikes (2–4)
          <input
            aria-label="Wing put strikes"
            className={input}
            value={strikes}
            onChange={(e) => setStrikes(e.target.value)}
          />
        </label>
        <label className="flex flex-col gap-1">
          Expiries in days (1–2)
          <input
            aria-label="Wing expiries in days"
            className={input}
            value={days}
            onChange={(e) => setDays(e.target.value)}
          />
        </label>
        <label className="flex flex-col gap-1">
          Premium budget
          <input
            aria-label="Wing premium budget"
            className={input}
            value={budget}
            onChange={(e) => setBudget(e.target.value)}
          />
        </label>
        <button
          type="submit"
          disabled={suggest.isPending}
          className="rounded bg-teal px-3 py-1.5 font-semibold text-paper disabled:opacity-50"
        >
          {suggest.isPending ? 'Solving…' : 'Suggest a wing hedge'}
        </button>
      </form>
      {(problem || suggest.isError) && (
        <p role="alert" className="text-sm text-stressed">
          {problem ?? `The suggestion failed: ${(suggest.error as Error).message}`}
        </p>
      )}
      {answer && (
        <WingAnswer
          answer={answer}
          onReplay={replay}
          replayNote={
            tooLong
              ? `A leg expires after ${MAX_REPLAY_YEARS} years, beyond what Replay takes.`
              : replayable.length !== positions.length
                ? 'Replay takes the option legs; the holding of the underlying is left to its delta hedge.'
                : null
          }
          canReplay={!tooLong && replayable.length > 0 && replayable.length <= 20}
        />
      )}
    </section>
  );
}

function WingAnswer({
  answer: full,
  onReplay,
  replayNote,
  canReplay,
}: {
  answer: Answer;
  onReplay: () => void;
  replayNote: string | null;
  canReplay: boolean;
}) {
  const answer = full.ladder;
  const instruments = full.ask.wingHedge.instruments;
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const x = answer.moves.map((m) => 100 * m);
    const axis = { gridcolor: t.grid, zerolinecolor: t.muted, tickfont: { color: t.muted } };
    const data: Data[] = [
      {
        type: 'scatter',
        mode: 'lines',
        x,
        y: answer.before,
        name: 'book now',
        line: { color: t.base, width: 2 },
      },
      {
        type: 'scatter',
        mode: 'lines',
        x,
        y: answer.after,
        name: 'with the wing hedge (premium included)',
        line: { color: t.teal, width: 2, dash: 'dash' },
      },
    ];
    const layout: Partial<Layout> = {
      ...chartFrame(t, 12),
      height: 300,
      margin: { l: 70, r: 12, t: 10, b: 44 },
      legend: legendRow('above', 0.02),
      xaxis: { ...axis, title: { text: 'instant move of the underlying (%)' }, ticksuffix: '%' },
      yaxis: { ...axis, title: { text: 'book P&L' } },
    };
    return { data, layout };
  }, [answer, theme]);
  const used = instruments.map((o, j) => ({
    ...o,
    q: answer.quantities[j],
    price: answer.prices[j],
  }));
  return (
    <div className="space-y-2" data-testid="wing-answer">
      <table className="tabular text-right text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="px-2 text-left font-normal">put</th>
            <th className="px-2 font-normal">days</th>
            <th className="px-2 font-normal">buy</th>
            <th className="px-2 font-normal">model price</th>
            <th className="px-2 font-normal">premium</th>
          </tr>
        </thead>
        <tbody>
          {used.map((o, j) => (
            <tr key={j} className={`border-t border-rule/60 ${o.q > 0 ? '' : 'text-muted'}`}>
              <td className="px-2 text-left">{formatNumber(o.strike, 2)}</td>
              <td className="px-2">{formatNumber(o.expiry * 365, 0)}</td>
              <td className="px-2">{formatNumber(o.q, 2)}</td>
              <td className="px-2">{formatNumber(o.price, 4)}</td>
              <td className="px-2">{formatNumber(o.q * o.price, 2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="tabular text-sm" data-testid="wing-summary">
        Premium paid {formatNumber(answer.premium, 2)} · worst ladder P&amp;L from −30 % to −5 %:{' '}
        {formatNumber(answer.worstBefore, 2)} now, {formatNumber(answer.worstAfter, 2)} with the
        hedge
        {full.pilot &&
          ` · pilot ES99 (mean P&L of the worst 1 % of ${full.pilot.paths.toLocaleString()} paths, seed ${full.ask.seed}): ${formatNumber(full.pilot.esBefore, 2)} now, ${formatNumber(full.pilot.esAfter, 2)} with the hedge`}
      </p>
      <PlotlyChart data={figure.data} layout={figure.layout} />
      <div className="flex items-center gap-3">
        <button
          type="button"
          onClick={onReplay}
          disabled={!canReplay || answer.premium === 0}
          className="rounded border border-teal px-3 py-1 text-sm font-semibold text-teal disabled:opacity-50"
        >
          Replay with this overlay
        </button>
        {replayNote && <span className="text-xs text-muted">{replayNote}</span>}
      </div>
    </div>
  );
}
