/**
 * A scheduled move's size as a calibration coordinate, named `events.<i>.size`: the standard
 * deviation of a normal move, or the up move of a two-point move (its down move keeps its ratio
 * to the up move, so the law keeps its shape and only its scale is fitted).
 */
import type { FitBox, Model, ScheduledMove } from '../core';

export const EVENT_SIZE_BOX: FitBox = {
  lo: 5e-4,
  hi: 0.5,
  startLo: 0.005,
  startHi: 0.08,
  guess: 0.03,
};

export const eventSizeKey = (index: number): string => `events.${index}.size`;

/** The event index of an `events.<i>.size` name, or null for a model parameter. */
export function eventSizeIndex(name: string): number | null {
  const m = /^events\.(\d+)\.size$/.exec(name);
  return m ? Number(m[1]) : null;
}

export function eventSize(e: ScheduledMove): number {
  return e.law === 'normal' ? e.stdev : e.up;
}

function resized(e: ScheduledMove, size: number): ScheduledMove {
  if (e.law === 'normal') return { ...e, stdev: size };
  const ratio = e.down / e.up;
  return { ...e, up: size, down: Math.max(-0.99, ratio * size) };
}

/** The model with event `index` at `size` (a new events list; the rest untouched). */
export function withEventSize(model: Model, index: number, size: number): Model {
  const events = model.events ?? [];
  return { ...model, events: events.map((e, i) => (i === index ? resized(e, size) : e)) } as Model;
}
