import { applyAffine, type Affine, type PlanePoint } from '#shared/tracer/affine';
import { axisCoordinate, type AxisScale } from '#shared/tracer/axes';

/**
 * A picture made by hand: axis coordinates scaled, rotated by `degrees` (clockwise on screen, as a
 * scan fed in askew), flipped so the vertical axis rises upwards, and shifted. Returns the
 * transform from straight axis coordinates to pixels, the thing a calibration has to recover.
 */
export function pictureTransform({ degrees, pxPerX, pxPerY, origin }: { degrees: number; pxPerX: number; pxPerY: number; origin: PlanePoint }): Affine {
  const r = (degrees * Math.PI) / 180;
  const cos = Math.cos(r);
  const sin = Math.sin(r);
  // Scale, flip y (pixels grow downwards), then rotate.
  return { a: cos * pxPerX, b: sin * pxPerY, c: sin * pxPerX, d: -cos * pxPerY, e: origin.x, f: origin.y };
}

/** Where a pair of axis values is drawn in a hand-made picture. */
export function drawnAt(t: Affine, value: PlanePoint, scales: { x: AxisScale; y: AxisScale } = { x: 'linear', y: 'linear' }): PlanePoint {
  const u = axisCoordinate(value.x, scales.x);
  const v = axisCoordinate(value.y, scales.y);
  if (u === null || v === null) throw new Error('value cannot be drawn on these axes');
  return applyAffine(t, { x: u, y: v });
}
