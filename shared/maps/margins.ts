import type { CompressorCurve } from './types';

/**
 * Margins of an operating point on a compressor map (docs/physics.md, "Margins"; the whole edge
 * they are measured against is in boundary.ts):
 *   surge margin  = (ṁc − ṁc,surge(PR)) / ṁc   — flow distance to the surge line at the same PR
 *   choke margin  = (ṁc,edge(PR) − ṁc) / ṁc    — flow distance to the map's right edge at the same PR
 *   speed margin  = (Nmax − N) / Nmax
 * Positive is safe; negative says how far past the limit the point is. ṁc is corrected mass flow
 * at the map's reference conditions, so the margins do not depend on the map's units.
 */

/** A polyline y(x) with x strictly increasing, read by linear interpolation. */
export interface PiecewiseLinear {
  readonly xMin: number;
  readonly xMax: number;
  /** y at x; null outside [xMin, xMax] (no extrapolation). */
  at(x: number): number | null;
  /** y at x, holding the end values beyond the ends (for deciding which side of a line a point is). */
  clamped(x: number): number;
}

export function piecewiseLinear(xs: readonly number[], ys: readonly number[]): PiecewiseLinear {
  if (xs.length < 2 || xs.length !== ys.length) throw new Error('piecewiseLinear needs at least two points and one y per x');
  for (let i = 1; i < xs.length; i++) {
    if (!(xs[i] > xs[i - 1])) throw new Error('piecewiseLinear needs strictly increasing x');
  }
  const x = Float64Array.from(xs);
  const y = Float64Array.from(ys);
  const last = x.length - 1;
  function interpolate(at: number): number {
    let low = 0;
    let high = last;
    while (high - low > 1) {
      const mid = (low + high) >> 1;
      if (x[mid] <= at) low = mid;
      else high = mid;
    }
    const share = (at - x[low]) / (x[high] - x[low]);
    return y[low] + share * (y[high] - y[low]);
  }
  return {
    xMin: x[0],
    xMax: x[last],
    at(at) {
      if (!(at >= x[0] && at <= x[last])) return null;
      return interpolate(at);
    },
    clamped(at) {
      if (at <= x[0]) return y[0];
      if (at >= x[last]) return y[last];
      return interpolate(at);
    },
  };
}

/** Corrected mass flow (kg/s) of a surge or choke line as a function of pressure ratio. */
export function flowByPressureRatio(curve: CompressorCurve): PiecewiseLinear {
  return piecewiseLinear(
    curve.points.map((p) => p.pressureRatio),
    curve.points.map((p) => p.correctedMassFlow),
  );
}

/** Pressure ratio of a speed line as a function of corrected mass flow (kg/s). */
export function pressureRatioByFlow(curve: CompressorCurve): PiecewiseLinear {
  return piecewiseLinear(
    curve.points.map((p) => p.correctedMassFlow),
    curve.points.map((p) => p.pressureRatio),
  );
}
