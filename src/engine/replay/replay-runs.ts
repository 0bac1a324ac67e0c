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
  const why =
    saved.engineVersion !== engineVersion
      ? `it was saved with engine ${saved.engineVersion} and this is engine ${engineVersion}`
      : `the engine version is the same (${engineVersion}), so this is a defect to report`;
  return { matches: false, message: `does not match: ${why}. ${differing.join('; ')}` };
}
