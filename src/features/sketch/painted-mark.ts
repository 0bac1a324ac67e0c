/**
 * The User Timing mark `sketch:painted`: set once the frame that shows a new state of the smile
 * panels has been painted (a timeout set inside an animation frame runs after its paint), so that
 * a benchmark can measure from an input event to what the user sees. Its detail carries the
 * engine time of the request drawn and the stress shown.
 */
export const PAINTED_MARK = 'sketch:painted';

export interface PaintedDetail {
  engineMs: number;
  /** the stress drawn, as JSON: tells which state a paint belongs to */
  stress: string;
}

/** Call inside the animation frame that drew the new state: the mark follows its paint. */
export function markPainted(detail: PaintedDetail): void {
  if (typeof performance === 'undefined') return;
  setTimeout(() => {
    performance.clearMarks(PAINTED_MARK);
    performance.mark(PAINTED_MARK, { detail });
  }, 0);
}
