import { useQuery } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import { Link } from 'react-router';
import { ToolPage } from '../../components/ToolPage';
import { ScenarioSelect } from '../../components/ScenarioSelect';
import { ProgressBar } from '../../components/ProgressBar';
import { CsvInput } from '../../components/CsvInput';
import { FitCharts, ResidualMap } from '../../components/fit/FitCharts';
import { ParameterTable, ResidualTable, VerdictPanel } from '../../components/fit/FitReport';
import { RowIssues } from '../../components/RowIssues';
import type { CalibrationResult } from '../../engine/fit';
import { completeGuess } from '../../engine/fit';
import { parametersOf } from '../../engine/core';
import type { JumpsVerdict } from '../../engine/fit';
import { MAX_QUOTES_FILE_BYTES, parseQuotesCsv, type ParsedQuotes } from '../../engine/fit';
import type { ModelKind } from '../../engine/core';
import { localScenariosQuery, useSaveScenario } from '../../store/hooks';
import { CancelledError, runFit, type FitJob } from '../../workers/fit-client';

const KINDS: ModelKind[] = ['heston', 'bates', 'merton', 'heston-kou'];
const EXAMPLE =
  'expiry,strike,impliedVol\n2026-12-08,3900,0.31\n2026-12-08,4250,0.16\n0.25,4000,0.22\n0.25,4250,0.185';

type Outcome =
  { kind: 'fit'; result: CalibrationResult } | { kind: 'verdict'; verdict: JumpsVerdict };

export function FitPage() {
  const scenarios = useQuery(localScenariosQuery);
  const save = useSaveScenario();
  const [sourceId, setSourceId] = useState<string | null>(null);
  const [parsed, setParsed] = useState<ParsedQuotes | null>(null);
  const [kind, setKind] = useState<ModelKind>('bates');
  const [weights, setWeights] = useState<'uniform' | 'vega'>('uniform');
  const [fixed, setFixed] = useState<string[]>([]);
  const [progress, setProgress] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [savedId, setSavedId] = useState<string | null>(null);
  const job = useRef<FitJob<unknown> | null>(null);

  const source = scenarios.data?.find((s) => s.id === sourceId) ?? scenarios.data?.[0];
  if (scenarios.isPending) return <p className="text-muted">Opening…</p>;
  if (!source)
    return (
      <p className="text-muted">
        Open Sketch once so that this device has a scenario for the market and the starting point.
      </p>
    );
  const quotes = parsed?.quotes ?? [];

  const start = (what: 'fit' | 'verdict') => {
    setError(null);
    setOutcome(null);
    setSavedId(null);
    setProgress(0);
    const base = {
      market: source.document.market,
      quotes,
      fixed: fixed.filter((f) => (parametersOf(kind) as string[]).includes(f)),
      weights,
    };
    const guess = completeGuess(kind, source.document.model as unknown as Record<string, unknown>);
    const hestonGuess = completeGuess(
      'heston',
      source.document.model as unknown as Record<string, unknown>,
    ) as ReturnType<typeof completeGuess> & { kind: 'heston' };
    const run =
      what === 'fit'
        ? runFit((api, p) => api.calibrate({ ...base, model: guess }, p), setProgress)
        : runFit((api, p) => api.verdict({ ...base, hestonGuess }, p), setProgress);
    job.current = run;
    run.result
      .then((r) =>
        setOutcome(
          what === 'fit'
            ? { kind: 'fit', result: r as CalibrationResult }
            : { kind: 'verdict', verdict: r as JumpsVerdict },
        ),
      )
      .catch((e: Error) =>
        setError(
          e instanceof CancelledError ? 'Cancelled.' : `The calibration failed: ${e.message}`,
        ),
      )
      .finally(() => {
        setProgress(null);
        job.current = null;
      });
  };

  const fitted =
    outcome?.kind === 'fit'
      ? outcome.result
      : outcome?.kind === 'verdict'
        ? outcome.verdict.bates
        : null;
  const saveAsScenario = async () => {
    if (!fitted) return;
    const id = crypto.randomUUID();
    await save.mutateAsync({
      ...source.document,
      id,
      name: `${source.document.name} — fitted ${fitted.model.kind}`,
      model: fitted.model,
      stress: {},
      runs: [],
      fit: { quotes, rmseVolPoints: fitted.rmseVolPoints, weights, fixed },
    });
    setSavedId(id);
  };

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
            onChange={setSourceId}
          >
            <span className="text-xs text-muted">
              spot {source.document.market.spot}, valuation {source.document.valuationDate}
            </span>
          </ScenarioSelect>
          <label className="flex flex-col gap-1 text-sm">
            <span className="text-xs font-semibold uppercase tracking-wide text-muted">Model</span>
            <select
              aria-label="Model to fit"
              value={kind}
              onChange={(e) => setKind(e.target.value as ModelKind)}
              className="rounded border border-rule bg-panel px-2 py-1.5"
            >
              {KINDS.map((k) => (
                <option key={k} value={k}>
                  {k}
                </option>
              ))}
            </select>
          </label>
          <fieldset className="space-y-1 text-sm">
            <legend className="text-xs font-semibold uppercase tracking-wide text-muted">
              Hold fixed
            </legend>
            <div className="flex flex-wrap gap-x-3">
              {parametersOf(kind).map((p) => (
                <label key={p} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    checked={fixed.includes(p)}
                    onChange={() =>
                      setFixed(fixed.includes(p) ? fixed.filter((x) => x !== p) : [...fixed, p])
                    }
                  />{' '}
                  {p}
                </label>
              ))}
            </div>
          </fieldset>
          <label className="flex flex-col gap-1 text-sm">
            <span className="text-xs font-semibold uppercase tracking-wide text-muted">
              Weights
            </span>
            <select
              value={weights}
              onChange={(e) => setWeights(e.target.value as 'uniform' | 'vega')}
              className="rounded border border-rule bg-panel px-2 py-1.5"
            >
              <option value="uniform">uniform (bid-ask spread if given)</option>
              <option value="vega">vega (the wings count less)</option>
            </select>
          </label>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              disabled={quotes.length === 0 || progress !== null}
              onClick={() => start('fit')}
              className="rounded bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-50"
            >
              Fit {kind}
            </button>
            <button
              type="button"
              disabled={quotes.length === 0 || progress !== null}
              onClick={() => start('verdict')}
              className="rounded border border-teal px-4 py-1.5 text-teal disabled:opacity-50"
            >
              Compare Heston and Bates
            </button>
          </div>
          {progress !== null && (
            <ProgressBar
              fraction={progress}
              onCancel={() => job.current?.cancel()}
              testId="fit-progress"
            />
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
        onText={(t) =>
          setParsed(parseQuotesCsv(t, source.document.market, source.document.valuationDate))
        }
        onTooLarge={(m) => setParsed({ quotes: [], issues: [], fileError: m })}
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
          <FitCharts
            residuals={fitted.residuals}
            compare={outcome?.kind === 'verdict' ? outcome.verdict.heston.residuals : undefined}
          />
          <ResidualMap residuals={fitted.residuals} />
          <ResidualTable result={fitted} />
        </div>
      )}
    </ToolPage>
  );
}
