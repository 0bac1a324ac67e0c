import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { useSchemaResolver } from '../../../components/use-schema-resolver';
import { firstFormError } from '../../../components/form-errors';
import { ToolPage } from '../../../components/ToolPage';
import { SaveRunButton } from '../../../components/SaveRunButton';
import { ScenarioSelect } from '../../../components/ScenarioSelect';
import { SeedField, SettingField } from '../../../components/SettingField';
import { ProgressBar } from '../../../components/ProgressBar';
import { formatNumber, formatTenor } from '../../../components/format';
import { PathsCharts } from './PathsCharts';
import { ENGINE_VERSION } from '../../../engine/core';
import { appDb } from '../../../store/db';
import { useSaveScenario } from '../../../store/hooks';
import { useScenarioSource } from '../../../store/use-scenario-source';
import { clearCache } from '../../../store/result-cache';
import { cacheSizeQuery, pathsKeys } from '../api/queries';
import { usePathsRun } from '../hooks/use-paths-run';
import {
  DEFAULT_PATHS_FORM,
  pathsFormSchema,
  type PathsForm,
  type PathsSettings,
} from '../paths-form';

/** "put 0.9× spot": the type the form gives a strike (a put below spot, a call from spot up). */
const optionLabel = (m: string | undefined) =>
  m === undefined ? '' : `${Number(m) < 1 ? 'put' : 'call'} ${m}× spot`;

export function PathsPage() {
  const { scenarios, source, stressed, setSourceId } = useScenarioSource();
  const cache = useQuery(cacheSizeQuery);
  const qc = useQueryClient();
  const save = useSaveScenario();
  // the strikes are fractions of the chosen scenario's spot, read when the form is checked
  const resolver = useSchemaResolver(() => pathsFormSchema(stressed?.market.spot ?? 0));
  const { control, register, handleSubmit, getValues, formState, clearErrors } = useForm<
    PathsForm,
    unknown,
    PathsSettings
  >({ resolver, defaultValues: DEFAULT_PATHS_FORM });
  const [stressError, setStressError] = useState<string | null>(null);
  const [ranWith, setRanWith] = useState<PathsForm | null>(null);
  const [saved, setSaved] = useState(false);
  const { start, cancel, progress, lastProgress, run, error } = usePathsRun();
  if (scenarios.isPending) return <p className="text-muted">Opening…</p>;
  if (!source || !stressed)
    return (
      <p className="text-muted">Open Sketch once so that this device has a scenario to simulate.</p>
    );

  const invalid = firstFormError(formState.errors);
  const formError =
    stressError ?? (invalid ? `${invalid.path || 'settings'}: ${invalid.message}` : null);
  const complete = (s: PathsSettings) => ({
    ...s,
    antithetic: s.antithetic ?? true,
    scheme: s.scheme ?? 'qe',
    options: s.options ?? [],
  });
  const go = handleSubmit((settings) => {
    if (stressed.issues.length > 0)
      return setStressError(
        `the scenario's stress is out of range: ${stressed.issues[0].path} ${stressed.issues[0].message}`,
      );
    setStressError(null);
    setSaved(false);
    setRanWith(getValues());
    void start(stressed.market, stressed.model, complete(settings)).then(() =>
      qc.invalidateQueries({ queryKey: pathsKeys.cacheSize }),
    );
  });
  const saveRun = async () => {
    if (!run || !ranWith) return;
    const checked = pathsFormSchema(stressed.market.spot).safeParse(ranWith);
    if (!checked.success) return;
    const s = complete(checked.data);
    const entry = {
      kind: 'paths',
      savedAt: new Date().toISOString(),
      engineVersion: ENGINE_VERSION,
      settings: s,
      seed: s.seed,
      summary: {
        estimates: run.summary.estimates,
        terminal: run.summary.terminal,
        jumpsPerPath: run.summary.jumpsPerPath,
      },
    };
    await save.mutateAsync({ ...source.document, runs: [...(source.document.runs ?? []), entry] });
    setSaved(true);
  };
  const field = (key: 'paths' | 'stepsPerDay' | 'horizonDays', label: string) => (
    <Controller
      control={control}
      name={key}
      render={({ field: f }) => (
        <SettingField
          label={label}
          value={f.value}
          onChange={(v) => {
            clearErrors();
            f.onChange(v);
          }}
        />
      )}
    />
  );

  return (
    <ToolPage
      title="Paths"
      asideWidth="20rem"
      aside={
        <>
          <ScenarioSelect
            label="Scenario (with its stress)"
            scenarios={scenarios.data!}
            value={source.id}
            onChange={setSourceId}
          />
          {field('paths', 'Paths')}
          {field('stepsPerDay', 'Steps per day')}
          {field('horizonDays', 'Horizon (days)')}
          <Controller
            control={control}
            name="seed"
            render={({ field: f }) => <SeedField value={f.value} onChange={f.onChange} />}
          />
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register('antithetic')} /> antithetic pairs
          </label>
          <label className="grid grid-cols-[1fr_8rem] items-center gap-2 text-sm">
            <span>Variance scheme</span>
            <select
              aria-label="Variance scheme"
              className="rounded border border-rule bg-panel px-2 py-1"
              {...register('scheme')}
            >
              <option value="qe">Andersen QE</option>
              <option value="euler">Euler (full truncation)</option>
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm">
            <span>Options at the horizon, strikes as fractions of spot</span>
            <input
              aria-label="Option strikes"
              className="rounded border border-rule bg-panel px-2 py-1"
              {...register('strikes')}
            />
          </label>
          <button
            type="button"
            onClick={() => void go()}
            disabled={progress !== null}
            className="rounded bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-50"
          >
            Simulate
          </button>
          {progress !== null && (
            <ProgressBar fraction={progress} onCancel={cancel} testId="paths-progress" />
          )}
          {(formError || error) && (
            <p role="alert" className="text-sm text-stressed">
              {formError ?? error}
            </p>
          )}
          <p className="text-xs text-muted">
            Cache:{' '}
            {cache.data
              ? `${cache.data.entries} runs, ${(cache.data.bytes / 1024 / 1024).toFixed(1)} MB`
              : '…'}{' '}
            <button
              type="button"
              className="text-teal"
              onClick={() =>
                void clearCache(appDb()).then(() =>
                  qc.invalidateQueries({ queryKey: pathsKeys.cacheSize }),
                )
              }
            >
              clear cache
            </button>
          </p>
        </>
      }
    >
      {!run ? (
        <p className="text-muted">
          Set the run up and press Simulate. The same settings and seed give the same numbers on any
          machine and with any number of workers.
        </p>
      ) : (
        <>
          <p
            className="tabular text-sm"
            data-testid="paths-summary"
            data-from-cache={run.fromCache ? 'yes' : 'no'}
            data-final-progress={run.fromCache ? '' : String(Math.round(100 * lastProgress))}
          >
            {run.summary.paths.toLocaleString()} paths × {run.summary.steps} steps, seed{' '}
            {run.summary.seed} ·{' '}
            {run.fromCache
              ? 'opened from the cache'
              : `${run.summary.elapsedMs.toFixed(0)} ms on ${run.workers} worker${run.workers > 1 ? 's' : ''}`}{' '}
            · mean S_T {formatNumber(run.summary.terminal.mean, 3)} ±{' '}
            {formatNumber(run.summary.terminal.meanStdError, 3)} ·{' '}
            {formatNumber(run.summary.jumpsPerPath, 3)} jumps a path
          </p>
          {run.summary.estimates.length > 0 && (
            <table className="tabular text-right text-sm" data-testid="mc-table">
              <thead className="text-xs text-muted">
                <tr>
                  {[
                    'option',
                    'Monte Carlo',
                    'std. error',
                    'with control variate',
                    'its std. error',
                    'analytic (COS)',
                    '(controlled − COS) / s.e.',
                  ].map((h) => (
                    <th key={h} className="px-3 font-normal">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {run.summary.estimates.map((e, i) => (
                  <tr key={i} className="border-t border-rule/60">
                    <td className="px-3 text-left">
                      {optionLabel(ranWith?.strikes.split(/[,\s]+/).filter(Boolean)[i])},{' '}
                      {formatTenor(Number(ranWith?.horizonDays) / 365)}
                    </td>
                    <td className="px-3">{formatNumber(e.price, 4)}</td>
                    <td className="px-3">{formatNumber(e.stdError, 4)}</td>
                    <td className="px-3">{formatNumber(e.priceControlled, 4)}</td>
                    <td className="px-3">{formatNumber(e.stdErrorControlled, 4)}</td>
                    <td className="px-3">{formatNumber(run.analytic[i], 4)}</td>
                    <td className="px-3">
                      {e.stdErrorControlled > 0
                        ? ((e.priceControlled - run.analytic[i]) / e.stdErrorControlled).toFixed(2)
                        : '—'}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          <SaveRunButton onSave={() => void saveRun()} saved={saved} />
          {run.view && (
            <PathsCharts
              view={run.view}
              histogram={run.histogram}
              spec={run.spec}
              density={run.density}
              meanTerminal={run.summary.terminal.mean}
            />
          )}
        </>
      )}
    </ToolPage>
  );
}
