/**
 * Axis scales of a pictured map. A linear axis places a value at a distance proportional to the
 * value; a logarithmic axis at a distance proportional to its logarithm. Either way the picture is
 * a straight (affine) image of the "axis coordinate" computed here, which is what the calibration
 * fits.
 */

export const AXIS_SCALES = ['linear', 'log'] as const;
export type AxisScale = (typeof AXIS_SCALES)[number];

/**
 * The straight coordinate of `value` on an axis: the value itself on a linear axis, log10 of it on
 * a logarithmic one. Null when the value cannot be on that axis (not finite; zero or negative on a
 * logarithmic axis).
 */
export function axisCoordinate(value: number, scale: AxisScale): number | null {
  if (!Number.isFinite(value)) return null;
  if (scale === 'linear') return value;
  return value > 0 ? Math.log10(value) : null;
}

/** The value at a straight axis coordinate (the inverse of axisCoordinate). */
export function axisValue(coordinate: number, scale: AxisScale): number {
  return scale === 'linear' ? coordinate : 10 ** coordinate;
}

/** Words for a scale, for messages. */
export function scaleWords(scale: AxisScale): string {
  return scale === 'linear' ? 'linear' : 'logarithmic';
}
