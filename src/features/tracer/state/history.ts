import type { TraceState } from '#shared/tracer/state';

/** Undo and redo over whole trace states (states are small and never mutated, so keeping them is cheap). */
export interface TraceHistory {
  past: TraceState[];
  present: TraceState;
  future: TraceState[];
  /** Edits with the same key close together (typing in one field, one drag) make one undo step. */
  lastKey: string | null;
  lastAt: number;
}

export const MAX_UNDO_STEPS = 200;
/** How long after the last keystroke a new one still joins the same undo step, ms. */
export const COALESCE_MS = 1500;

export function startHistory(present: TraceState): TraceHistory {
  return { past: [], present, future: [], lastKey: null, lastAt: 0 };
}

export function record(history: TraceHistory, next: TraceState, key: string | null, now: number): TraceHistory {
  if (next === history.present) return history;
  if (key !== null && key === history.lastKey && now - history.lastAt < COALESCE_MS) {
    return { ...history, present: next, future: [], lastAt: now };
  }
  const past = [...history.past, history.present].slice(-MAX_UNDO_STEPS);
  return { past, present: next, future: [], lastKey: key, lastAt: now };
}

export function undo(history: TraceHistory): TraceHistory {
  const previous = history.past[history.past.length - 1];
  if (!previous) return history;
  return { past: history.past.slice(0, -1), present: previous, future: [history.present, ...history.future], lastKey: null, lastAt: 0 };
}

export function redo(history: TraceHistory): TraceHistory {
  const next = history.future[0];
  if (!next) return history;
  return { past: [...history.past, history.present], present: next, future: history.future.slice(1), lastKey: null, lastAt: 0 };
}
