import type { MapKind } from '#shared/maps/format';
import type { PlanePoint } from '#shared/tracer/affine';
import type { AxisScale } from '#shared/tracer/axes';
import type { ReferenceRole } from '#shared/tracer/calibration';
import { usualCrossing, type TraceCurveKind, type TraceState } from '#shared/tracer/state';

// Every change the Tracer makes to a trace, as pure functions of the state: the editor records
// each result in its history (undo, redo) and the draft autosaves it.

/** A short id not yet used among `taken`: `c1`, `c2`, … */
export function freshId(prefix: string, taken: Iterable<string>): string {
  const used = new Set(taken);
  for (let n = 1; ; n++) if (!used.has(`${prefix}${n}`)) return `${prefix}${n}`;
}

export function setKind(state: TraceState, kind: MapKind): TraceState {
  if (state.kind === kind) return state;
  const old = usualCrossing(state.kind, state.turbine.flowParameterAxis);
  const crossing = state.calibration.crossing;
  // The crossing values follow the kind while the user has left them at the usual ones.
  const untouched = crossing.x === old.x && crossing.y === old.y;
  return {
    ...state,
    kind,
    calibration: { ...state.calibration, crossing: untouched ? usualCrossing(kind, state.turbine.flowParameterAxis) : crossing },
  };
}

export function setFlowParameterAxis(state: TraceState, axis: 'x' | 'y'): TraceState {
  const old = usualCrossing('turbine', state.turbine.flowParameterAxis);
  const crossing = state.calibration.crossing;
  const untouched = crossing.x === old.x && crossing.y === old.y;
  return {
    ...state,
    turbine: { ...state.turbine, flowParameterAxis: axis },
    calibration: { ...state.calibration, crossing: untouched ? usualCrossing('turbine', axis) : crossing },
  };
}

export function setScale(state: TraceState, axis: 'x' | 'y', scale: AxisScale): TraceState {
  return { ...state, scales: { ...state.scales, [axis]: scale } };
}

export function setCrossing(state: TraceState, axis: 'x' | 'y', value: number | null): TraceState {
  return { ...state, calibration: { ...state.calibration, crossing: { ...state.calibration.crossing, [axis]: value } } };
}

function mapClicks(
  state: TraceState,
  id: string,
  change: (click: TraceState['calibration']['clicks'][number]) => TraceState['calibration']['clicks'][number],
): TraceState {
  return { ...state, calibration: { ...state.calibration, clicks: state.calibration.clicks.map((c) => (c.id === id ? change(c) : c)) } };
}

export function setClickValue(state: TraceState, id: string, axis: 'x' | 'y', value: number | null): TraceState {
  return mapClicks(state, id, (c) => ({ ...c, [axis]: value }));
}

export function placeClick(state: TraceState, id: string, pixel: PlanePoint | null): TraceState {
  return mapClicks(state, id, (c) => ({ ...c, pixel }));
}

export function addClick(state: TraceState, role: ReferenceRole): { state: TraceState; id: string } {
  const id = freshId(
    role === 'x-axis' ? 'x' : role === 'y-axis' ? 'y' : role === 'crossing' ? 'corner' : 'p',
    state.calibration.clicks.map((c) => c.id),
  );
  const click = { id, role, pixel: null, x: null, y: null };
  return { state: { ...state, calibration: { ...state.calibration, clicks: [...state.calibration.clicks, click] } }, id };
}

export function removeClick(state: TraceState, id: string): TraceState {
  return { ...state, calibration: { ...state.calibration, clicks: state.calibration.clicks.filter((c) => c.id !== id) } };
}

export function addCurve(state: TraceState, kind: TraceCurveKind): { state: TraceState; id: string } {
  const id = freshId(
    'line',
    state.curves.map((c) => c.id),
  );
  return { state: { ...state, curves: [...state.curves, { id, kind, speed: null, efficiency: null, points: [] }] }, id };
}

export function removeCurve(state: TraceState, id: string): TraceState {
  return { ...state, curves: state.curves.filter((c) => c.id !== id) };
}

function mapCurve(state: TraceState, id: string, change: (curve: TraceState['curves'][number]) => TraceState['curves'][number]): TraceState {
  return { ...state, curves: state.curves.map((c) => (c.id === id ? change(c) : c)) };
}

export function setCurveValue(state: TraceState, id: string, field: 'speed' | 'efficiency', value: number | null): TraceState {
  return mapCurve(state, id, (c) => ({ ...c, [field]: value }));
}

export function addPoint(state: TraceState, curveId: string, pixel: PlanePoint): TraceState {
  return mapCurve(state, curveId, (c) => ({ ...c, points: [...c.points, pixel] }));
}

export function movePoint(state: TraceState, curveId: string, index: number, pixel: PlanePoint): TraceState {
  return mapCurve(state, curveId, (c) => ({ ...c, points: c.points.map((p, i) => (i === index ? pixel : p)) }));
}

export function deletePoint(state: TraceState, curveId: string, index: number): TraceState {
  return mapCurve(state, curveId, (c) => ({ ...c, points: c.points.filter((_, i) => i !== index) }));
}

/** Pixels kept to a tenth, so that drafts stay small and a point's place survives a save exactly. */
export function roundPixel(p: PlanePoint): PlanePoint {
  return { x: Math.round(p.x * 10) / 10, y: Math.round(p.y * 10) / 10 };
}
