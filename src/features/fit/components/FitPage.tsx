import { useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link } from 'react-router';
import { CsvInput } from '../../../components/CsvInput';
import { formatNumber, formatTenor } from '../../../components/format';
import { ProgressBar } from '../../../components/ProgressBar';
import { RowIssues } from '../../../components/RowIssues';
import { ScenarioSelect } from '../../../components/ScenarioSelect';
import { ToolPage } from '../../../components/ToolPage';
import { modelShortLabel, riskFreeRate, type Market } from '../../../engine/core';
import {
  MAX_QUOTES_FILE_BYTES,
  parseQuotesCsv,
  SPOT_MISMATCH,
  fitHistoryOf,
  historyEntry,
  spreadErrors,
  withEntry,
  type ChainVolQuote,
  type ParsedQuotes,
} from '../../../engine/fit';
import { ArbitrageList, ForwardsTable } from './ChainPanel';
import { FitHistoryChart } from './FitHistoryChart';
import { useDemoHistory } from '../hooks/use-demo-history';
import { localScenariosQuery, useSaveScenario } from '../../../store/hooks';
import type { FitSettings } from '../fit-settings';
import { useFitJob } from '../hooks/use-fit-job';
import { useDemoChain } from '../hooks/use-demo-chain';
import { FitCharts, ResidualMap } from './FitCharts';
import { FitSettingsForm } from './FitSettingsForm';
import { ParameterTable, ResidualTable, VerdictPanel } from './FitReport';

const EXAMPLE =
  'expiry,strike,impliedVol\n2026-12-08,3900,0.31\n2026-12-08,4250,0.16\n0.25,4000,0.22\n0.25,4250,0.185';

export function FitPage() {
  const scenarios = useQuery(localScenariosQuery);
  const save = useSaveScenario();
  const [sourceId, setSourceId] = useState<string | null>(null);
  const [parsed, setParsed] = useState<ParsedQuotes | null>(null);
  const [text, setText] = useState('');
  // the spot the quotes imply, once the user has chosen to take it
  const [spotFromQuotes, setSpotFromQuotes] = useState<number | null>(null);
  const [ranMarket, setRanMarket] = useState<Market | null>(null);
  const [settings, setSettings] = useState<FitSettings | null>(null);
  const [savedId, setSavedId] = useState<string | null>(null);
  // chains: discount from the scenario's rate instead of parity; flagged quotes left out
  const [useRate, setUseRate] = useState(false);
  const [dropFlagged, setDropFlagged] = useState(false);
  const job = useFitJob();

  const source = scenarios.data?.find((s) => s.id === sourceId) ?? scenarios.data?.[0];
  // the first scenario shown stays the source: saving one (a fit's history) re-sorts the list
  const firstId = scenarios.data?.[0]?.id ?? null;
  useEffect(() => {
    if (sourceId === null && firstId !== null) setSourceId(firstId);
  }, [sourceId, firstId]);
  const history = source ? fitHistoryOf(source.document) : [];
  const demoHistory = useDemoHistory();
  const loadDemoChain = useDemoChain(source?.document);
  if (scenarios.isPending) return <p className="text-muted">Opening…</p>;
  if (!source)
    return (
      <p className="text-muted">
        Open Sketch once so that this device has a scenario for the market and the starting point.
      </p>
    );
  const flagged = new Set(
    (parsed?.arbitrage ?? []).flatMap((f) => f.quotes.map((q) => `${q.expiry}|${q.strike}`)),
  );
  const quotes = (parsed?.quotes ?? []).filter(
    (q) => !dropFlagged || !flagged.has(`${q.expiry}|${q.strike}`),
  );
  const chainQuotes = parsed?.chain ? (quotes as ChainVolQuote[]) : null;
  const { progress, outcome, fitted, error } = job;
  const market: Market =
    spotFromQuotes === null
      ? source.document.market
      : { ...source.document.market, spot: spotFromQuotes };
  const readQuotes = (t: string, m: Market, fromRate = useRate) => {
    setText(t);
    setParsed(
      parseQuotesCsv(
        t,
        m,
        source.document.valuationDate,
        fromRate ? { rate: riskFreeRate(m, 1) } : {},
      ),
    );
  };
  const implied = parsed?.impliedSpot;
  const mismatch =
    implied !== undefined && Math.abs(implied / market.spot - 1) > SPOT_MISMATCH ? implied : null;
  const takeSpot = (spot: number) => {
    setSpotFromQuotes(spot);
    readQuotes(text, { ...source.document.market, spot });
  };

  const run = (what: 'fit' | 'verdict') => (chosen: FitSettings) => {
    setSettings(chosen);
    setSavedId(null);
    setRanMarket(market);
    void job.start(what, {
      market,
      startFrom: source.document.model,
      quotes,
      settings: chosen,
      valuationDate: source.document.valuationDate,
      history,
    });
  };

  const saveAsScenario = async () => {
    if (!fitted) return;
    const id = crypto.randomUUID();
    await save.mutateAsync({
      ...source.document,
      // the market the fit ran on: the quotes' spot when it was taken from them
      market: ranMarket ?? market,
      id,
      name: `${source.document.name} — fitted ${modelShortLabel(fitted.model.kind)}`,
      model: fitted.model,
      stress: {},
      runs: [],
      fit: {
        quotes,
        rmseVolPoints: fitted.rmseVolPoints,
        weights: settings?.weights,
        fixed: settings?.fixed,
      },
    });
    setSavedId(id);
  };

  /** The fit joins the source scenario's history (kept in its document, so it syncs). */
  const addToHistory = async () => {
    if (!fitted) return;
    const entry = historyEntry(source.document.valuationDate, fitted, quotes);
    await save.mutateAsync({ ...source.document, fitHistory: withEntry(history, entry) });
  };
  const buildHistory = async () => {
    const entries = await demoHistory.run(source.document);
    if (entries)
      await save.mutateAsync({
        ...source.document,
        fitHistory: entries.reduce((h, e) => withEntry(h, e), history),
      });
  };

  // the fit ran on these quotes in this order: residuals line up with them
  const spread =
    fitted && chainQuotes && fitted.residuals.length === chainQuotes.length
      ? spreadErrors(
          chainQuotes,
          fitted.residuals.map((r) => r.model),
        )
      : null;

  return (
    <ToolPage
      title="Fit"
      asideWidth="22rem"
      aside={
        <>
          <ScenarioSelect
            label="Market and starting point from"
            scenarios={scenarios.data!}
            value={source.id}
            onChange={(id) => {
              setSourceId(id);
              setSpotFromQuotes(null);
            }}
          >
            <span className="text-xs text-muted">
              spot {market.spot}
              {spotFromQuotes !== null && ' (from the quotes)'}, valuation{' '}
              {source.document.valuationDate}
            </span>
          </ScenarioSelect>
          <FitSettingsForm
            disabled={quotes.length === 0 || progress !== null}
            eventCount={source.document.model.events?.length ?? 0}
            onFit={run('fit')}
            onVerdict={run('verdict')}
          />
          {progress !== null && (
            <ProgressBar fraction={progress} onCancel={job.cancel} testId="fit-progress" />
          )}
          {error && (
            <p role="alert" className="text-sm text-stressed">
              {error}
            </p>
          )}
        </>
      }
    >
      <CsvInput
        hint="expiry (date or years), strike, and impliedVol — or type with price, or bid and ask; optional forward, or rate and dividend, per row"
        placeholder={EXAMPLE}
        maxBytes={MAX_QUOTES_FILE_BYTES}
        testId="quotes-file"
        label="Quotes CSV"
        onText={(t) => readQuotes(t, market)}
        onTooLarge={(m) => setParsed({ quotes: [], issues: [], arbitrage: [], fileError: m })}
        sample={{
          label: 'Load the demo chain',
          load: loadDemoChain,
        }}
      />
      {parsed?.fileError && (
        <p role="alert" className="text-sm text-stressed">
          {parsed.fileError}
        </p>
      )}
      {parsed && !parsed.fileError && (
        <p className="text-sm" data-testid="quotes-summary">
          {parsed.quotes.length} quotes kept over {new Set(parsed.quotes.map((q) => q.expiry)).size}{' '}
          expiries, {parsed.issues.length} rows rejected.
        </p>
      )}
      {mismatch !== null && (
        <div
          role="status"
          className="flex flex-wrap items-center gap-3 rounded border border-stressed/40 p-2 text-sm"
          data-testid="spot-mismatch"
        >
          <span>
            The quotes&apos; forwards imply a spot of {formatNumber(mismatch, 2)},{' '}
            {formatNumber(100 * (mismatch / market.spot - 1), 1)} % from the scenario&apos;s{' '}
            {formatNumber(market.spot, 2)}. A fit on the wrong spot misreads the whole smile.
          </span>
          <button
            type="button"
            onClick={() => takeSpot(mismatch)}
            className="rounded border border-teal px-3 py-1 text-teal"
          >
            Use spot {formatNumber(mismatch, 2)} from the quotes
          </button>
        </div>
      )}
      {parsed?.chain && (
        <label className="flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={useRate}
            onChange={(e) => {
              setUseRate(e.target.checked);
              readQuotes(text, market, e.target.checked);
            }}
          />
          Take the discount from the scenario&apos;s rate instead of fitting it by parity
        </label>
      )}
      {parsed?.chain && <ForwardsTable chain={parsed.chain} />}
      {parsed && !parsed.fileError && parsed.quotes.length > 0 && (
        <ArbitrageList
          flags={parsed.arbitrage}
          dropFlagged={dropFlagged}
          onDropFlagged={setDropFlagged}
        />
      )}
      {parsed && <RowIssues issues={parsed.issues} />}
      {fitted && (
        <div className="space-y-4">
          {outcome?.kind === 'verdict' && <VerdictPanel verdict={outcome.verdict} />}
          <ParameterTable result={fitted} />
          <div className="flex items-center gap-3">
            <button
              type="button"
              onClick={() => void saveAsScenario()}
              className="rounded bg-teal px-4 py-1.5 text-sm font-semibold text-paper"
            >
              Save as scenario
            </button>
            <button
              type="button"
              onClick={() => void addToHistory()}
              className="rounded border border-teal px-4 py-1.5 text-sm text-teal"
            >
              Add to the calibration history of {source.name}
            </button>
            {savedId && (
              <Link
                to={`/?scenario=${savedId}`}
                className="text-sm text-teal underline"
                data-testid="saved-scenario-link"
              >
                Saved — open it in Sketch
              </Link>
            )}
          </div>
          {spread && (
            <p className="tabular text-sm" data-testid="within-spread">
              Within the bid–ask spread:{' '}
              {spread.withinSpread
                .map((w) => `${formatTenor(w.expiry)} ${(100 * w.share).toFixed(0)} %`)
                .join(' · ')}
            </p>
          )}
          <FitCharts
            residuals={fitted.residuals}
            compare={outcome?.kind === 'verdict' ? outcome.verdict.heston.residuals : undefined}
            spreads={chainQuotes ?? undefined}
          />
          <ResidualMap residuals={fitted.residuals} />
          <ResidualTable result={fitted} halfSpreads={spread?.inHalfSpreads} />
        </div>
      )}
      <section className="space-y-2" aria-label="Calibration history">
        <div className="flex flex-wrap items-center gap-3">
          <h2 className="text-lg font-semibold">Calibration history of {source.name}</h2>
          <button
            type="button"
            disabled={demoHistory.progress !== null}
            onClick={() => void buildHistory()}
            className="rounded border border-rule px-3 py-1 text-sm hover:border-ink disabled:opacity-50"
          >
            Build a demo history (invented chains, last 5 days)
          </button>
        </div>
        {demoHistory.progress !== null && (
          <ProgressBar
            fraction={demoHistory.progress}
            onCancel={demoHistory.cancel}
            testId="history-progress"
          />
        )}
        {history.length === 0 ? (
          <p className="text-sm text-muted">
            No fits saved for this scenario yet: “Add to the calibration history” after a fit keeps
            its date, quotes digest, parameters and their standard errors here.
          </p>
        ) : (
          <FitHistoryChart history={history} />
        )}
      </section>
    </ToolPage>
  );
}
