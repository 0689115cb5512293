import type { PlanePoint } from '#shared/tracer/affine';

/** How the picture sits on the canvas: screen = image·scale + offset, in CSS pixels. */
export interface CanvasView {
  scale: number;
  x: number;
  y: number;
}

export const MIN_SCALE = 0.05;
export const MAX_SCALE = 40;

export function clampScale(scale: number): number {
  return Math.min(MAX_SCALE, Math.max(MIN_SCALE, scale));
}

/** The whole picture, centred, with a margin round it. */
export function fitView(image: { width: number; height: number }, canvas: { width: number; height: number }, margin = 12): CanvasView {
  const scale = clampScale(Math.min((canvas.width - 2 * margin) / image.width, (canvas.height - 2 * margin) / image.height));
  return { scale, x: (canvas.width - image.width * scale) / 2, y: (canvas.height - image.height * scale) / 2 };
}

/** One image pixel to one screen pixel, keeping the point under `anchor` where it is. */
export function actualSizeView(view: CanvasView, anchor: PlanePoint): CanvasView {
  return zoomAt(view, 1 / view.scale, anchor);
}

/** Zooms by `factor` about a screen point, which stays over the same picture point. */
export function zoomAt(view: CanvasView, factor: number, anchor: PlanePoint): CanvasView {
  const scale = clampScale(view.scale * factor);
  const k = scale / view.scale;
  return { scale, x: anchor.x - (anchor.x - view.x) * k, y: anchor.y - (anchor.y - view.y) * k };
}

export function toScreen(view: CanvasView, p: PlanePoint): PlanePoint {
  return { x: p.x * view.scale + view.x, y: p.y * view.scale + view.y };
}

export function toImage(view: CanvasView, p: PlanePoint): PlanePoint {
  return { x: (p.x - view.x) / view.scale, y: (p.y - view.y) / view.scale };
}
