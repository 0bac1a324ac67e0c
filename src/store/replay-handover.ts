/**
 * A position handed from one page to the Replay page (the Book's "replay with this overlay"):
 * kept in session storage so that a reload on the way does not lose it, taken once.
 */
import type { Leg } from '../engine/replay';

export interface ReplayHandover {
  scenarioId: string;
  legs: Leg[];
  overlay: Leg[];
  /** the seed the overlay was found on, so the full replay runs on the same paths */
  seed?: number;
}

const KEY = 'saltation.replay.handover';

export function handToReplay(handover: ReplayHandover): void {
  try {
    sessionStorage.setItem(KEY, JSON.stringify(handover));
  } catch {
    // storage disabled: the Replay page opens with its own form
  }
}

export function takeReplayHandover(): ReplayHandover | null {
  try {
    const raw = sessionStorage.getItem(KEY);
    sessionStorage.removeItem(KEY);
    const parsed = raw ? (JSON.parse(raw) as ReplayHandover) : null;
    return parsed && Array.isArray(parsed.legs) && Array.isArray(parsed.overlay) ? parsed : null;
  } catch {
    return null;
  }
}
