/**
 * Replay runs saved into a scenario's `runs`: the full request (market and model as they were,
 * position, hedges, paths, seed), the engine version and the summary with its P&L digest.
 * Replaying one recomputes it and says whether it matches to the last bit, and if not, why.
 */
import type { HedgeSettings, ReplayRequest } from './replay';
import type { ReplaySummary } from './replay-summary';
import { replayRequestSchema } from './request-schema';

export type RunSummary = Pick<ReplaySummary, 'pnl' | 'attribution' | 'worstPath' | 'digest'>;

export interface SavedReplayRun {
  kind: 'replay';
  id: string;
  savedAt: string;
  engineVersion: string;
  /** the position, its overlay (when there was one) and the first hedge */
  request: ReplayRequest;
  /** a second hedge replayed on the same paths, when there was one */
  compare?: HedgeSettings;
  seed: number;
  summaries: RunSummary[];
  /**
   * The JavaScript engine that computed it: the browser's user agent (or "Node v20…"). Engines
   * may round the last bit of Math.exp, Math.log, Math.sin … differently (measured: Chromium 156
   * and Node 20 differ on 3–11 % of arguments of exp, log, sin, cos, atan2 and pow), so a run
   * replays bit for bit under the same one.
   * Absent from runs saved before it was recorded.
   */
  runtime?: string;
}

/** A short name for a runtime string: the browser and its major version, else the string. */
export function runtimeName(runtime: string): string {
  // Edge and Opera also name Chrome, and Chrome names Safari: the most specific first
  for (const [pattern, name] of [
    [/Edg\/(\d+)/, 'Edge'],
    [/OPR\/(\d+)/, 'Opera'],
    [/Firefox\/(\d+)/, 'Firefox'],
    [/HeadlessChrome\/(\d+)/, 'headless Chrome'],
    [/Chrome\/(\d+)/, 'Chrome'],
    [/Version\/(\d+)[^ ]* (?:Mobile\/\S+ )?Safari/, 'Safari'],
    [/^Node v?(\d+)/, 'Node'],
  ] as const) {
    const m = pattern.exec(runtime);
    if (m) return `${name} ${m[1]}`;
  }
  return runtime.length > 60 ? `${runtime.slice(0, 57)}…` : runtime;
}

export const summaryOf = (s: ReplaySummary): RunSummary => ({
  pnl: s.pnl,
  attribution: s.attribution,
  worstPath: s.worstPath,
  digest: s.digest,
});

/**
 * The requests of a run: its own hedge, then the compared one on the same paths; with an
 * overlay, each hedge first without it and then with it.
 */
export function runRequests(run: Pick<SavedReplayRun, 'request' | 'compare'>): ReplayRequest[] {
  const hedges = run.compare ? [run.request.hedge, run.compare] : [run.request.hedge];
  return hedges.flatMap((hedge) => {
    const withOverlay = { ...run.request, hedge };
    if (!run.request.overlay?.length) return [withOverlay];
    const { overlay, ...plain } = withOverlay;
    void overlay;
    return [plain, withOverlay];
  });
}

/** The replay runs among a scenario's runs; entries that are not well-formed are skipped. */
export function savedReplayRuns(runs: readonly Record<string, unknown>[] | undefined) {
  return (runs ?? []).filter(
    (r): r is SavedReplayRun & Record<string, unknown> =>
      r.kind === 'replay' &&
      typeof r.id === 'string' &&
      typeof r.engineVersion === 'string' &&
      Array.isArray(r.summaries) &&
      replayRequestSchema.safeParse(r.request).success,
  );
}

export interface ReplayCheck {
  matches: boolean;
  message: string;
}

/** Compares a recomputed run with the saved one, number by number and digest by digest. */
export function checkReplay(
  saved: SavedReplayRun,
  fresh: RunSummary[],
  engineVersion: string,
  runtime?: string,
): ReplayCheck {
  const same = (a: unknown, b: unknown): boolean =>
    typeof a === 'number' && typeof b === 'number'
      ? Object.is(a, b)
      : typeof a === 'object' && a !== null && typeof b === 'object' && b !== null
        ? Object.keys(a).every((k) => same((a as never)[k], (b as never)[k]))
        : a === b;
  const differing = saved.summaries.flatMap((s, i) => {
    const f = fresh[i];
    if (!f) return [`hedge ${i + 1} is missing`];
    if (same(s, f)) return [];
    return [
      `hedge ${i + 1}: digest ${s.digest} saved, ${f.digest} now; mean P&L ${s.pnl.mean} saved, ${f.pnl.mean} now`,
    ];
  });
  if (differing.length === 0)
    return {
      matches: true,
      message: `matches to the last bit (engine ${engineVersion}, digest ${fresh.map((f) => f.digest).join(', ')})`,
    };
  const roundingNote =
    'JavaScript engines may round the last bit of Math.exp, Math.log or Math.sin differently';
  const why =
    saved.engineVersion !== engineVersion
      ? `it was saved with engine ${saved.engineVersion} and this is engine ${engineVersion}`
      : saved.runtime && runtime && saved.runtime !== runtime
        ? `it was computed under ${runtimeName(saved.runtime)} and now under ${runtimeName(runtime)}: ${roundingNote}, so a run compares bit for bit under the same browser and version`
        : saved.runtime && runtime
          ? `the engine version (${engineVersion}) and the browser are the same, so this is a defect to report`
          : `the engine version is the same (${engineVersion}); the run does not record its browser: if it was computed in another browser or version, ${roundingNote}, otherwise this is a defect to report`;
  return { matches: false, message: `does not match: ${why}. ${differing.join('; ')}` };
}
