import type { TraceState } from '#shared/tracer/state';

/** What is selected in the picture: a point of a line, a placed reference point, or nothing. */
export type Selection = { kind: 'point'; curveId: string; index: number } | { kind: 'click'; id: string } | null;

/** The selection if it still exists in `state` (undo may have taken it away), else null. */
export function validSelection(selection: Selection, state: TraceState): Selection {
  if (selection?.kind === 'point') return state.curves.find((c) => c.id === selection.curveId)?.points[selection.index] ? selection : null;
  if (selection?.kind === 'click') return state.calibration.clicks.some((c) => c.id === selection.id && c.pixel) ? selection : null;
  return null;
}

/** The first reference point not yet placed in the picture. */
export function firstUnplaced(state: TraceState): string | null {
  return state.calibration.clicks.find((c) => c.pixel === null)?.id ?? null;
}

/** The next reference point still to place after `after`, going round. */
export function nextUnplaced(state: TraceState, after: string): string | null {
  const clicks = state.calibration.clicks;
  const i = clicks.findIndex((c) => c.id === after);
  return [...clicks.slice(i + 1), ...clicks.slice(0, i)].find((c) => c.pixel === null && c.id !== after)?.id ?? null;
}
