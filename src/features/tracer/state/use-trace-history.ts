import { useCallback, useEffect, useReducer } from 'react';
import type { TraceState } from '#shared/tracer/state';
import { record, redo, startHistory, undo, type TraceHistory } from './history';

/** A change to the trace; edits with the same key close together make one undo step. */
export type ChangeTrace = (change: (state: TraceState) => TraceState, key?: string | null) => void;

type HistoryAction =
  | { type: 'apply'; change: (state: TraceState) => TraceState; key: string | null; now: number }
  | { type: 'undo' }
  | { type: 'redo' }
  | { type: 'reset'; state: TraceState };

function historyReducer(history: TraceHistory, action: HistoryAction): TraceHistory {
  switch (action.type) {
    case 'apply':
      return record(history, action.change(history.present), action.key, action.now);
    case 'undo':
      return undo(history);
    case 'redo':
      return redo(history);
    case 'reset':
      return startHistory(action.state);
  }
}

/**
 * The trace on screen with its undo history. Only an editor changes it; Ctrl+Z and Ctrl+Shift+Z
 * (or Ctrl+Y) undo and redo, except in text fields (they have their own).
 */
export function useTraceHistory(start: TraceState, canEdit: boolean) {
  const [history, dispatch] = useReducer(historyReducer, start, startHistory);

  const change: ChangeTrace = useCallback(
    (fn, key = null) => {
      if (canEdit) dispatch({ type: 'apply', change: fn, key, now: Date.now() });
    },
    [canEdit],
  );

  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (!(event.ctrlKey || event.metaKey) || !canEdit) return;
      const target = event.target as HTMLElement | null;
      if (target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT')) return;
      const key = event.key.toLowerCase();
      if (key === 'z' && !event.shiftKey) dispatch({ type: 'undo' });
      else if ((key === 'z' && event.shiftKey) || key === 'y') dispatch({ type: 'redo' });
      else return;
      event.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [canEdit]);

  return {
    state: history.present,
    change,
    canUndo: history.past.length > 0,
    canRedo: history.future.length > 0,
    undo: () => dispatch({ type: 'undo' }),
    redo: () => dispatch({ type: 'redo' }),
    /** Starts again from `state` (a newer trace loaded over this one), with no history. */
    reset: (state: TraceState) => dispatch({ type: 'reset', state }),
  };
}
