import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { ToolPage } from '../../../components/ToolPage';
import { SaveRunButton } from '../../../components/SaveRunButton';
import { ScenarioSelect } from '../../../components/ScenarioSelect';
import { SeedField, SettingField } from '../../../components/SettingField';
import { ProgressBar } from '../../../components/ProgressBar';
import { formatNumber, formatTenor } from '../../../components/format';
import { PathsCharts } from './PathsCharts';
import { simulationSettingsSchema } from '../../../engine/paths';
import { type OptionSpec, ENGINE_VERSION } from '../../../engine/core';
import { appDb } from '../../../store/db';
import { useSaveScenario } from '../../../store/hooks';
import { useScenarioSource } from '../../../store/use-scenario-source';
import { cacheSize, clearCache } from '../../../store/result-cache';
import { usePathsRun } from '../hooks/use-paths-run';

export function PathsPage() {
  const { scenarios, source, stressed, setSourceId } = useScenarioSource();
  const cache = useQuery({ queryKey: ['local', 'cache-size'], queryFn: () => cacheSize(appDb()) });
  const qc = useQueryClient();
  const save = useSaveScenario();
  const [form, setForm] = useState({
    paths: '20000',
    stepsPerDay: '1',
    horizonDays: '30',
    seed: String(20261201),
    antithetic: true,
    scheme: 'qe' as 'qe' | 'euler',
  });
  const [strikes, setStrikes] = useState('0.9, 1, 1.1');
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { start, cancel, progress, lastProgress, run, error } = usePathsRun();
  if (scenarios.isPending) return <p className="text-muted">Opening…</p>;
  if (!source || !stressed)
    return (
      <p className="text-muted">Open Sketch once so that this device has a scenario to simulate.</p>
    );

  const settingsFromForm = () => {
    const horizon = Number(form.horizonDays) / 365;
    const options: OptionSpec[] = strikes
      .split(/[,\s]+/)
      .filter(Boolean)
      .flatMap((m) => {
        const K = Number(m) * stressed.market.spot;
        return [{ type: Number(m) < 1 ? 'put' : 'call', strike: K, expiry: horizon } as OptionSpec];
      });
    const raw = {
      horizon,
      stepsPerYear: Number(form.stepsPerDay) * 365,
      paths: Number(form.paths),
      seed: Number(form.seed),
      antithetic: form.antithetic,
      scheme: form.scheme,
      options,
    };
    const r = simulationSettingsSchema.safeParse(raw);
    if (!r.success) {
      const i = r.error.issues[0];
      setFormError(`${i.path.join('.') || 'settings'}: ${i.message}`);
      return null;
    }
    setFormError(null);
    return { ...raw, antithetic: form.antithetic };
  };
  const go = () => {
    if (stressed.issues.length > 0)
      return setFormError(
        `the scenario's stress is out of range: ${stressed.issues[0].path} ${stressed.issues[0].message}`,
      );
    const s = settingsFromForm();
    setSaved(false);
    if (s)
      void start(stressed.market, stressed.model, s).then(() =>
        qc.invalidateQueries({ queryKey: ['local', 'cache-size'] }),
      );
  };
  const saveRun = async () => {
    if (!run) return;
    const s = settingsFromForm();
    if (!s) return;
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
    <SettingField
      label={label}
      value={form[key]}
      onChange={(v) => setForm({ ...form, [key]: v })}
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
          <SeedField value={form.seed} onChange={(seed) => setForm({ ...form, seed })} />
          <label className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={form.antithetic}
              onChange={(e) => setForm({ ...form, antithetic: e.target.checked })}
            />{' '}
            antithetic pairs
          </label>
          <label className="grid grid-cols-[1fr_8rem] items-center gap-2 text-sm">
            <span>Variance scheme</span>
            <select
              aria-label="Variance scheme"
              value={form.scheme}
              onChange={(e) => setForm({ ...form, scheme: e.target.value as 'qe' | 'euler' })}
              className="rounded border border-rule bg-panel px-2 py-1"
            >
              <option value="qe">Andersen QE</option>
              <option value="euler">Euler (full truncation)</option>
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm">
            <span>Options at the horizon, strikes as fractions of spot</span>
            <input
              aria-label="Option strikes"
              value={strikes}
              onChange={(e) => setStrikes(e.target.value)}
              className="rounded border border-rule bg-panel px-2 py-1"
            />
          </label>
          <button
            type="button"
            onClick={go}
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
                  qc.invalidateQueries({ queryKey: ['local', 'cache-size'] }),
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
                      {strikes.split(/[,\s]+/).filter(Boolean)[i]}× spot,{' '}
                      {formatTenor(Number(form.horizonDays) / 365)}
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
