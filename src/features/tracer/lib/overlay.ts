import type { PlanePoint } from '#shared/tracer/affine';
import type { TraceBuild } from '#shared/tracer/build';
import { dataToPixel, pixelToData } from '#shared/tracer/calibration';
import type { TraceCurve, TraceState } from '#shared/tracer/state';
import type { Overlay, OverlayClick, OverlayGridLine, OverlayLine } from './draw';
import { gridLabel, gridValues } from './grid';

export interface OverlaySelection {
  activeCurveId: string | null;
  armedClickId: string | null;
  selectedClickId: string | null;
  selectedPoint: { curveId: string; index: number } | null;
  /** Reference clicks are drawn while calibrating, and faintly useful afterwards too. */
  showClicks: boolean;
}

function shortLabel(curve: TraceCurve, state: TraceState, flowIndex: number): string {
  switch (curve.kind) {
    case 'surge':
      return 'surge';
    case 'choke':
      return 'choke';
    case 'speed':
      return curve.speed === null ? 'speed ?' : `${curve.speed} ${state.speedUnit}`;
    case 'island':
      return curve.efficiency === null ? 'island ?' : `${curve.efficiency}${state.efficiency === 'percent' ? ' %' : ''}`;
    case 'flow':
      return curve.speed === null ? `line ${flowIndex}` : `${curve.speed} ${state.speedUnit}`;
  }
}

/** A reference click's label over the picture: the value it stands for. */
export function clickLabel(click: TraceState['calibration']['clicks'][number], state: TraceState): string {
  const show = (v: number | null) => (v === null ? '?' : String(v));
  const crossing = state.calibration.crossing;
  switch (click.role) {
    case 'x-axis':
      return `x ${show(click.x)}`;
    case 'y-axis':
      return `y ${show(click.y)}`;
    case 'crossing':
      return `corner (${show(crossing.x)}, ${show(crossing.y)})`;
    case 'point':
      return `(${show(click.x)}, ${show(click.y)})`;
  }
}

/** The calibrated grid: round axis values across the whole picture, as straight lines in it. */
function grid(build: TraceBuild, state: TraceState, size: { width: number; height: number }): OverlayGridLine[] {
  if (!build.calibration.ok) return [];
  const cal = build.calibration.calibration;
  const corners = [
    { x: 0, y: 0 },
    { x: size.width, y: 0 },
    { x: 0, y: size.height },
    { x: size.width, y: size.height },
  ].map((p) => pixelToData(cal, p));
  const xs = corners.map((c) => c.x).filter(Number.isFinite);
  const ys = corners.map((c) => c.y).filter(Number.isFinite);
  const [xMin, xMax, yMin, yMax] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const lines: OverlayGridLine[] = [];
  for (const x of gridValues(xMin, xMax, state.scales.x)) {
    const from = dataToPixel(cal, { x, y: yMin });
    const to = dataToPixel(cal, { x, y: yMax });
    if (from && to) lines.push({ from, to, label: gridLabel(x) });
  }
  for (const y of gridValues(yMin, yMax, state.scales.y)) {
    const from = dataToPixel(cal, { x: xMin, y });
    const to = dataToPixel(cal, { x: xMax, y });
    if (from && to) lines.push({ from, to, label: gridLabel(y) });
  }
  return lines;
}

/** What is drawn over the picture: the grid the calibration implies, every line as it will be written, and the reference clicks. */
export function buildOverlay(state: TraceState, build: TraceBuild, selection: OverlaySelection, size: { width: number; height: number }): Overlay {
  const traced = new Map(build.lines.map((l) => [l.id, l]));
  let flowIndex = 0;
  const lines: OverlayLine[] = state.curves.map((curve) => {
    if (curve.kind === 'flow') flowIndex++;
    const written = traced.get(curve.id);
    // Before the calibration fits there are no values: the clicks are joined in the order made.
    const path: PlanePoint[] = written ? written.points.map((p) => p.pixel) : curve.points;
    return {
      id: curve.id,
      kind: curve.kind,
      label: shortLabel(curve, state, flowIndex),
      active: curve.id === selection.activeCurveId,
      path,
      points: curve.points.map((pixel, index) => ({ index, pixel })),
    };
  });
  const cal = build.calibration.ok ? build.calibration.calibration : null;
  const crossing = state.calibration.crossing;
  const clicks: OverlayClick[] = selection.showClicks
    ? state.calibration.clicks.flatMap((click) => {
        if (!click.pixel) return [];
        const x = click.role === 'y-axis' || click.role === 'crossing' ? crossing.x : click.x;
        const y = click.role === 'x-axis' || click.role === 'crossing' ? crossing.y : click.y;
        const fitted = cal && x !== null && y !== null ? dataToPixel(cal, { x, y }) : null;
        return [
          {
            id: click.id,
            label: clickLabel(click, state),
            pixel: click.pixel,
            fitted,
            armed: click.id === selection.armedClickId,
            selected: click.id === selection.selectedClickId,
          },
        ];
      })
    : [];
  return { grid: grid(build, state, size), lines, clicks, selectedPoint: selection.selectedPoint };
}
