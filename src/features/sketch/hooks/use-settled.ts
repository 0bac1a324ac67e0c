/**
 * A value that follows its source once the source has stopped changing for `ms`: the views
 * beside the smile panels (term structure, density, tables) catch up when a slider drag pauses
 * instead of redrawing on every step of it. A change that `waitsFor` does not accept (anything
 * but a new stress: a model edit, another expiry) is followed at once.
 */
import { useEffect, useState } from 'react';

export function useSettled<T>(
  value: T,
  waitsFor: (shown: NonNullable<T>, next: NonNullable<T>) => boolean,
  ms = 200,
): T {
  const [settled, setSettled] = useState(value);
  const immediate =
    settled === undefined ||
    settled === null ||
    value === undefined ||
    value === null ||
    !waitsFor(settled, value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = setTimeout(() => setSettled(value), immediate ? 0 : ms);
    return () => clearTimeout(timer);
  }, [value, settled, ms, immediate]);
  return immediate ? value : settled;
}
