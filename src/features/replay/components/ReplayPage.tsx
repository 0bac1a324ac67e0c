import { useEffect, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { useSchemaResolver } from '../../../components/use-schema-resolver';
import { ToolPage } from '../../../components/ToolPage';
import { ProgressBar } from '../../../components/ProgressBar';
import { SaveRunButton } from '../../../components/SaveRunButton';
import { ScenarioSelect } from '../../../components/ScenarioSelect';
import { SeedField, SettingField } from '../../../components/SettingField';
import { DrillDownPanel } from './DrillDownPanel';
import { HedgeFields } from './HedgeFields';
import { LegsTable } from './LegsTable';
import { ReplayCharts } from './ReplayCharts';
import { ReplayStats } from './ReplayStats';
import { SavedRuns } from './SavedRuns';
import { formatNumber } from '../../../components/format';
import {
  checkReplay,
  runRequests,
  savedReplayRuns,
  summaryOf,
  type ReplayCheck,
  type ReplayRequest,
  type SavedReplayRun,
} from '../../../engine/replay';
import { ENGINE_VERSION } from '../../../engine/core';
import { useSaveScenario } from '../../../store/hooks';
import { useScenarioSource } from '../../../store/use-scenario-source';
import { formFromRun, formWithOverlay, loadForm, storeForm } from '../form/form-storage';
import { takeReplayHandover } from '../../../store/replay-handover';
import { useSearchParams } from 'react-router';
import {
  defaultReplayForm,
  formIssues,
  replayFormSchema,
  runsPerHedge,
  type ReplayForm,
} from '../form/replay-form';
import { useReplayRun } from '../hooks/use-replay-run';

type Source = ReturnType<typeof useScenarioSource>;

export function ReplayPage() {
  const source = useScenarioSource();
  if (source.scenarios.isPending) return <p className="text-muted">Opening…</p>;
  if (!source.source || !source.stressed)
    return (
      <p className="text-muted">Open Sketch once so that this device has a scenario to replay.</p>
    );
  return <ReplayWorkspace {...source} />;
}

function ReplayWorkspace({
  scenarios,
  source: maybeSource,
  stressed: maybeStressed,
  setSourceId,
}: Source) {
  const source = maybeSource!;
  const stressed = maybeStressed!;
  const save = useSaveScenario();
  // the requests are checked against the chosen scenario's market and model of the moment
  const resolver = useSchemaResolver(() => replayFormSchema(stressed.market, stressed.model));
  const { control, register, handleSubmit, watch, reset, formState, getValues } = useForm<
    ReplayForm,
    unknown,
    ReplayRequest[]
  >({ resolver, defaultValues: loadForm() ?? defaultReplayForm(stressed.market.spot) });
  const [stressError, setStressError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const [check, setCheck] = useState<{ id: string; result: ReplayCheck } | null>(null);
  const { start, cancel, progress, view, error } = useReplayRun();
  useEffect(() => {
    const sub = watch((values) => storeForm(values as ReplayForm));
    return () => sub.unsubscribe();
  }, [watch]);
  const overlayRows = watch('overlay');
  const perHedge = (overlayRows?.length ?? 0) > 0 ? 2 : 1;
  const { legIssues, overlayIssues, error: invalid } = formIssues(formState.errors, perHedge);
  const formError = stressError ?? invalid;
  const compareOn = watch('compareOn');
  const runs = savedReplayRuns(source.document.runs);

  // a position handed over by another page (the Book's wing hedge) opens here and runs at once,
  // on the seed it was found on and this form's path count
  const [params, setParams] = useSearchParams();
  const [pendingRun, setPendingRun] = useState<string | null>(null);
  useEffect(() => {
    if (!params.has('handover')) return;
    const handover = takeReplayHandover();
    setParams({}, { replace: true });
    if (!handover) return;
    setSourceId(handover.scenarioId);
    reset(formWithOverlay(getValues(), handover.legs, handover.overlay, handover.seed));
    setPendingRun(handover.scenarioId);
    // once, on arrival
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  const go = handleSubmit((requests) => {
    setSaved(false);
    setCheck(null);
    if (stressed.issues.length > 0)
      return setStressError(
        `the scenario's stress is out of range: ${stressed.issues[0].path} ${stressed.issues[0].message}`,
      );
    setStressError(null);
    void start(requests);
  });
  useEffect(() => {
    if (pendingRun === null || source.id !== pendingRun) return;
    setPendingRun(null);
    void go();
  }, [pendingRun, source.id, go]);
  const update = (next: ReplayForm) => reset(next);
  const saveRun = async () => {
    if (!view) return;
    // with an overlay the runs come in pairs (without, with); the saved request carries it
    const pair = runsPerHedge(view.requests);
    const entry: SavedReplayRun = {
      kind: 'replay',
      id: crypto.randomUUID(),
      savedAt: new Date().toISOString(),
      engineVersion: ENGINE_VERSION,
      request: view.requests[pair - 1],
      ...(view.requests[pair] ? { compare: view.requests[pair].hedge } : {}),
      seed: view.requests[0].seed,
      summaries: view.results.map(summaryOf),
      runtime: navigator.userAgent,
    };
    await save.mutateAsync({
      ...source.document,
      runs: [...(source.document.runs ?? []), { ...entry }],
    });
    setSaved(true);
  };
  const replaySaved = async (run: SavedReplayRun) => {
    setCheck(null);
    const fresh = await start(runRequests(run), true);
    if (fresh)
      setCheck({
        id: run.id,
        result: checkReplay(run, fresh.results.map(summaryOf), ENGINE_VERSION, navigator.userAgent),
      });
  };

  return (
    <ToolPage
      title="Replay"
      asideWidth="26rem"
      aside={
        <>
          <ScenarioSelect
            label="Scenario (with its stress)"
            scenarios={scenarios.data!}
            value={source.id}
            onChange={setSourceId}
          />
          <p className="text-xs text-muted">
            Spot {formatNumber(stressed.market.spot, 2)}; the legs are bought or sold at the
            model&apos;s price and hedged in the underlying until the last one expires.
          </p>
          <LegsTable
            control={control}
            register={register}
            issues={legIssues}
            spot={stressed.market.spot}
          />
          <h2 className="pt-1 text-sm font-semibold">Overlay</h2>
          <p className="text-xs text-muted">
            Options bought or sold at inception at the model&apos;s price and held to expiry. The
            hedge covers the position and the overlay together; each hedge is replayed without the
            overlay and with it, on the same paths.
          </p>
          <LegsTable
            control={control}
            register={register}
            issues={overlayIssues}
            spot={stressed.market.spot}
            name="overlay"
            noun="Overlay option"
            empty="No overlay."
          />
          <HedgeFields
            label="Hedge"
            name="hedge"
            method={watch('hedge.method')}
            register={register}
          />
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register('compareOn')} />
            compare with a second hedge on the same paths
          </label>
          {compareOn && (
            <HedgeFields
              label="Compared hedge"
              name="compare"
              method={watch('compare.method')}
              register={register}
            />
          )}
          <Controller
            control={control}
            name="paths"
            render={({ field }) => (
              <SettingField
                label="Paths"
                value={field.value}
                onChange={field.onChange}
                inputWidth="9rem"
              />
            )}
          />
          <Controller
            control={control}
            name="seed"
            render={({ field }) => (
              <SeedField value={field.value} onChange={field.onChange} inputWidth="9rem" />
            )}
          />
          <div className="flex gap-3">
            <button
              type="button"
              onClick={() => void go()}
              disabled={progress !== null}
              className="rounded bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-50"
            >
              Replay hedge
            </button>
            <button
              type="button"
              className="text-sm text-muted"
              onClick={() => update(defaultReplayForm(stressed.market.spot))}
            >
              Reset form
            </button>
          </div>
          {progress !== null && (
            <ProgressBar fraction={progress} onCancel={cancel} testId="replay-progress" />
          )}
          {(formError || error) && (
            <p role="alert" className="text-sm text-stressed">
              {formError ?? error}
            </p>
          )}
          <h2 className="pt-2 text-lg font-semibold">Saved runs</h2>
          <SavedRuns
            runs={runs}
            busy={progress !== null}
            check={check}
            onOpen={(run) => update(formFromRun(run))}
            onReplay={(run) => void replaySaved(run)}
          />
        </>
      }
    >
      {!view ? (
        <p className="text-muted">
          Build the position, choose the hedge and press Replay hedge. The same position, hedge,
          paths and seed give the same P&amp;L to the last bit on any machine with the same browser
          and version, and with any number of workers.
        </p>
      ) : (
        <>
          <p className="tabular text-sm" data-testid="replay-summary">
            {view.results[0].paths.toLocaleString()} paths × {view.results[0].steps} rebalances,
            seed {view.requests[0].seed} ·{' '}
            {view.fromCache
              ? 'opened from the cache'
              : `${view.results.reduce((a, r) => a + r.elapsedMs, 0).toFixed(0)} ms on ${view.workers} worker${view.workers > 1 ? 's' : ''}`}{' '}
            · premium {view.results[0].premium < 0 ? 'received' : 'paid'} for the position{' '}
            {formatNumber(Math.abs(view.results[0].premium), 4)}
            {view.requests.some((r) => (r.overlay?.length ?? 0) > 0) &&
              `, for the overlay ${view.results.at(-1)!.overlayPremium < 0 ? 'received' : 'paid'} ${formatNumber(Math.abs(view.results.at(-1)!.overlayPremium), 4)}`}{' '}
            · P&amp;L discounted to today
          </p>
          <ReplayStats requests={view.requests} results={view.results} />
          <div className="flex items-center gap-3">
            <SaveRunButton onSave={() => void saveRun()} saved={saved} />
          </div>
          <ReplayCharts
            requests={view.requests}
            results={view.results}
            histograms={view.histograms}
          />
          <DrillDownPanel
            requests={view.requests}
            worstPaths={view.results.map((r) => r.worstPath)}
          />
        </>
      )}
    </ToolPage>
  );
}
