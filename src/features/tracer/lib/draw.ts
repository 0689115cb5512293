import type { PlanePoint } from '#shared/tracer/affine';
import type { TraceCurveKind } from '#shared/tracer/state';
import { toScreen, type CanvasView } from './view';

// Drawing the trace over the picture. Everything here is in image pixels until drawn; the same
// scene is drawn twice, once on the canvas and once, enlarged, in the magnifier at the cursor.

export interface OverlayLine {
  id: string;
  kind: TraceCurveKind;
  /** Short label drawn at the line's end: `70000 rpm`, `74 %`, `surge`. */
  label: string;
  active: boolean;
  /** Through the values written in the file (in file order, islands closed), image pixels. */
  path: PlanePoint[];
  /** The clicked points, image pixels, with their index in the trace. */
  points: { index: number; pixel: PlanePoint }[];
}

export interface OverlayClick {
  id: string;
  label: string;
  pixel: PlanePoint;
  /** Where the fitted calibration puts this click's values (null before a fit). */
  fitted: PlanePoint | null;
  armed: boolean;
  selected: boolean;
}

export interface OverlayGridLine {
  from: PlanePoint;
  to: PlanePoint;
  label: string;
}

export interface Overlay {
  grid: OverlayGridLine[];
  lines: OverlayLine[];
  clicks: OverlayClick[];
  selectedPoint: { curveId: string; index: number } | null;
}

/** Line colours over a picture: the notebook's palette, with red kept for the surge line (a hard limit). */
export const LINE_COLOURS: Record<TraceCurveKind, string> = {
  surge: '#b91c1c',
  choke: '#b4632b',
  speed: '#0f766e',
  island: '#9d4b8a',
  flow: '#0f766e',
};

const CLICK_COLOUR = '#8f4a1c';
const GRID_COLOUR = 'rgba(15, 118, 110, 0.55)';
const HALO = 'rgba(255, 253, 248, 0.9)';
const FONT = '600 11px "Roboto Flex", system-ui, sans-serif';

function path(ctx: CanvasRenderingContext2D, view: CanvasView, points: PlanePoint[]) {
  ctx.beginPath();
  points.forEach((p, i) => {
    const s = toScreen(view, p);
    if (i === 0) ctx.moveTo(s.x, s.y);
    else ctx.lineTo(s.x, s.y);
  });
}

function label(ctx: CanvasRenderingContext2D, text: string, at: PlanePoint, colour: string, align: CanvasTextAlign = 'left') {
  ctx.font = FONT;
  ctx.textAlign = align;
  ctx.textBaseline = 'middle';
  ctx.lineWidth = 3;
  ctx.strokeStyle = HALO;
  ctx.strokeText(text, at.x, at.y);
  ctx.fillStyle = colour;
  ctx.fillText(text, at.x, at.y);
}

function drawGrid(ctx: CanvasRenderingContext2D, view: CanvasView, grid: OverlayGridLine[]) {
  ctx.save();
  ctx.setLineDash([4, 4]);
  ctx.lineWidth = 1;
  ctx.strokeStyle = GRID_COLOUR;
  for (const line of grid) {
    path(ctx, view, [line.from, line.to]);
    ctx.stroke();
  }
  ctx.setLineDash([]);
  for (const line of grid) {
    const s = toScreen(view, line.from);
    label(ctx, line.label, { x: s.x + 3, y: s.y - 7 }, '#115e59');
  }
  ctx.restore();
}

function drawLine(ctx: CanvasRenderingContext2D, view: CanvasView, line: OverlayLine, selected: Overlay['selectedPoint']) {
  const colour = LINE_COLOURS[line.kind];
  const width = line.active ? 2.5 : 1.75;
  ctx.save();
  ctx.lineJoin = 'round';
  ctx.lineCap = 'round';
  if (line.path.length > 1) {
    path(ctx, view, line.path);
    ctx.strokeStyle = HALO;
    ctx.lineWidth = width + 3;
    ctx.stroke();
    path(ctx, view, line.path);
    ctx.strokeStyle = colour;
    ctx.lineWidth = width;
    ctx.stroke();
  }
  const radius = line.active ? 4.5 : 3;
  for (const { index, pixel } of line.points) {
    const s = toScreen(view, pixel);
    ctx.beginPath();
    ctx.arc(s.x, s.y, radius, 0, 2 * Math.PI);
    ctx.fillStyle = colour;
    ctx.fill();
    ctx.lineWidth = 1.5;
    ctx.strokeStyle = HALO;
    ctx.stroke();
    if (selected && selected.curveId === line.id && selected.index === index) {
      ctx.beginPath();
      ctx.arc(s.x, s.y, radius + 5, 0, 2 * Math.PI);
      ctx.lineWidth = 2;
      ctx.strokeStyle = '#2b2b2b';
      ctx.stroke();
    }
  }
  const end = line.path[line.path.length - 1] ?? line.points[line.points.length - 1]?.pixel;
  if (end) {
    const s = toScreen(view, end);
    label(ctx, line.label, { x: s.x + 7, y: s.y - 8 }, colour);
  }
  ctx.restore();
}

function drawClick(ctx: CanvasRenderingContext2D, view: CanvasView, click: OverlayClick) {
  const s = toScreen(view, click.pixel);
  ctx.save();
  if (click.fitted) {
    // Where the fit puts this click's values: a long line here is a bad click.
    const f = toScreen(view, click.fitted);
    if (Math.hypot(f.x - s.x, f.y - s.y) > 1.5) {
      ctx.beginPath();
      ctx.moveTo(s.x, s.y);
      ctx.lineTo(f.x, f.y);
      ctx.strokeStyle = '#b91c1c';
      ctx.lineWidth = 1.5;
      ctx.stroke();
      ctx.beginPath();
      ctx.arc(f.x, f.y, 3, 0, 2 * Math.PI);
      ctx.stroke();
    }
  }
  const arm = 9;
  ctx.strokeStyle = HALO;
  ctx.lineWidth = 4;
  ctx.beginPath();
  ctx.moveTo(s.x - arm, s.y);
  ctx.lineTo(s.x + arm, s.y);
  ctx.moveTo(s.x, s.y - arm);
  ctx.lineTo(s.x, s.y + arm);
  ctx.stroke();
  ctx.strokeStyle = CLICK_COLOUR;
  ctx.lineWidth = click.selected || click.armed ? 2 : 1.5;
  ctx.stroke();
  ctx.beginPath();
  ctx.arc(s.x, s.y, 5, 0, 2 * Math.PI);
  ctx.stroke();
  label(ctx, click.label, { x: s.x + 10, y: s.y + 12 }, CLICK_COLOUR);
  ctx.restore();
}

function drawContent(
  ctx: CanvasRenderingContext2D,
  view: CanvasView,
  image: HTMLImageElement | null,
  imageSize: { width: number; height: number },
  overlay: Overlay,
) {
  if (image) {
    ctx.imageSmoothingEnabled = view.scale < 3;
    ctx.drawImage(image, view.x, view.y, imageSize.width * view.scale, imageSize.height * view.scale);
  }
  ctx.strokeStyle = 'rgba(43, 43, 43, 0.35)';
  ctx.lineWidth = 1;
  ctx.strokeRect(view.x - 0.5, view.y - 0.5, imageSize.width * view.scale + 1, imageSize.height * view.scale + 1);
  drawGrid(ctx, view, overlay.grid);
  const lines = [...overlay.lines].sort((a, b) => Number(a.active) - Number(b.active));
  for (const line of lines) drawLine(ctx, view, line, overlay.selectedPoint);
  for (const click of overlay.clicks) drawClick(ctx, view, click);
}

export interface SceneInput {
  width: number;
  height: number;
  view: CanvasView;
  image: HTMLImageElement | null;
  imageSize: { width: number; height: number };
  overlay: Overlay;
  /** The cursor over the canvas, CSS pixels; null when it is elsewhere. */
  cursor: PlanePoint | null;
  /** Full-width cross hairs at the cursor, for lining clicks up with the axes. */
  crosshair: boolean;
}

/** Magnification of the magnifier over the canvas's own zoom. */
export const MAGNIFIER_ZOOM = 4;
export const MAGNIFIER_RADIUS = 64;

/** Draws the picture, the calibrated grid, the traced lines, the reference clicks and the magnifier. */
export function drawScene(ctx: CanvasRenderingContext2D, input: SceneInput) {
  const { width, height, view, image, imageSize, overlay, cursor } = input;
  ctx.fillStyle = '#efe8d8';
  ctx.fillRect(0, 0, width, height);
  drawContent(ctx, view, image, imageSize, overlay);

  if (!cursor) return;
  if (input.crosshair) {
    ctx.save();
    ctx.strokeStyle = 'rgba(143, 74, 28, 0.45)';
    ctx.lineWidth = 1;
    ctx.beginPath();
    ctx.moveTo(0, cursor.y + 0.5);
    ctx.lineTo(width, cursor.y + 0.5);
    ctx.moveTo(cursor.x + 0.5, 0);
    ctx.lineTo(cursor.x + 0.5, height);
    ctx.stroke();
    ctx.restore();
  }

  // The magnifier sits beside the cursor (never under it), on whichever side has room.
  const r = MAGNIFIER_RADIUS;
  const gap = 28;
  const cx = cursor.x + gap + r < width ? cursor.x + gap + r : cursor.x - gap - r;
  const cy = cursor.y - gap - r > 0 ? cursor.y - gap - r : cursor.y + gap + r;
  const scale = view.scale * MAGNIFIER_ZOOM;
  const imageAtCursor = { x: (cursor.x - view.x) / view.scale, y: (cursor.y - view.y) / view.scale };
  const zoomed: CanvasView = { scale, x: cx - imageAtCursor.x * scale, y: cy - imageAtCursor.y * scale };
  ctx.save();
  ctx.beginPath();
  ctx.arc(cx, cy, r, 0, 2 * Math.PI);
  ctx.fillStyle = '#efe8d8';
  ctx.fill();
  ctx.clip();
  drawContent(ctx, zoomed, image, imageSize, overlay);
  ctx.strokeStyle = 'rgba(43, 43, 43, 0.8)';
  ctx.lineWidth = 1;
  ctx.beginPath();
  ctx.moveTo(cx - r, cy + 0.5);
  ctx.lineTo(cx - 6, cy + 0.5);
  ctx.moveTo(cx + 6, cy + 0.5);
  ctx.lineTo(cx + r, cy + 0.5);
  ctx.moveTo(cx + 0.5, cy - r);
  ctx.lineTo(cx + 0.5, cy - 6);
  ctx.moveTo(cx + 0.5, cy + 6);
  ctx.lineTo(cx + 0.5, cy + r);
  ctx.stroke();
  ctx.restore();
  ctx.beginPath();
  ctx.arc(cx, cy, r, 0, 2 * Math.PI);
  ctx.lineWidth = 2;
  ctx.strokeStyle = '#2b2b2b';
  ctx.stroke();
}
