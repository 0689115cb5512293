/**
 * Plane affine transforms and their least-squares fit. Used for the Tracer's calibration: a scan
 * that is shifted, scaled differently in each direction, slightly rotated or sheared is still an
 * affine image of the map's axes, so an affine fit from reference clicks places every other point.
 */

export interface PlanePoint {
  x: number;
  y: number;
}

/** to = (a·x + b·y + e, c·x + d·y + f) */
export interface Affine {
  a: number;
  b: number;
  c: number;
  d: number;
  e: number;
  f: number;
}

export function applyAffine(t: Affine, p: PlanePoint): PlanePoint {
  return { x: t.a * p.x + t.b * p.y + t.e, y: t.c * p.x + t.d * p.y + t.f };
}

/** The determinant of the linear part: the signed area scale. */
export function affineDeterminant(t: Affine): number {
  return t.a * t.d - t.b * t.c;
}

/**
 * The inverse transform, or null when the transform squeezes the plane onto a line (its
 * determinant is zero against the size of its coefficients).
 */
export function invertAffine(t: Affine): Affine | null {
  const det = affineDeterminant(t);
  const size = Math.max(Math.abs(t.a * t.d), Math.abs(t.b * t.c));
  if (!Number.isFinite(det) || det === 0 || Math.abs(det) <= 1e-12 * size) return null;
  const a = t.d / det;
  const b = -t.b / det;
  const c = -t.c / det;
  const d = t.a / det;
  return { a, b, c, d, e: -(a * t.e + b * t.f), f: -(c * t.e + d * t.f) };
}

export interface AffinePair {
  from: PlanePoint;
  to: PlanePoint;
}

export interface AffineFit {
  transform: Affine;
  /** Distance from each pair's `to` to where the fitted transform puts its `from`, in `to` units. */
  residuals: number[];
  /** Root mean square of the residuals. */
  rmsResidual: number;
  maxResidual: number;
  /**
   * Equations beyond the six unknowns (2 per pair − 6). Zero with three pairs: the fit is exact
   * whatever the pairs, so the residual says nothing; every pair more is a check.
   */
  degreesOfFreedom: number;
}

export type AffineFitResult = { ok: true; fit: AffineFit } | { ok: false; reason: 'too-few' | 'collinear' | 'not-finite' };

/**
 * The affine transform that maps each `from` to its `to` with the least sum of squared distances
 * (ordinary least squares; each output coordinate is its own three-unknown problem with the same
 * design matrix). The inputs are centred first, so that large pixel or data offsets do not cost
 * precision. Needs three pairs whose `from` points are not on one line.
 */
export function fitAffine(pairs: readonly AffinePair[]): AffineFitResult {
  if (pairs.length < 3) return { ok: false, reason: 'too-few' };
  for (const { from, to } of pairs) {
    if (![from.x, from.y, to.x, to.y].every(Number.isFinite)) return { ok: false, reason: 'not-finite' };
  }
  const n = pairs.length;
  let mx = 0;
  let my = 0;
  let tx = 0;
  let ty = 0;
  for (const { from, to } of pairs) {
    mx += from.x;
    my += from.y;
    tx += to.x;
    ty += to.y;
  }
  mx /= n;
  my /= n;
  tx /= n;
  ty /= n;

  // Normal equations of the centred problem: the constant term separates from the linear part.
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  let sxX = 0;
  let syX = 0;
  let sxY = 0;
  let syY = 0;
  for (const { from, to } of pairs) {
    const u = from.x - mx;
    const v = from.y - my;
    const X = to.x - tx;
    const Y = to.y - ty;
    sxx += u * u;
    sxy += u * v;
    syy += v * v;
    sxX += u * X;
    syX += v * X;
    sxY += u * Y;
    syY += v * Y;
  }
  const det = sxx * syy - sxy * sxy;
  // Collinear `from` points leave the direction across their line undetermined.
  if (!(det > 1e-12 * sxx * syy) || sxx === 0 || syy === 0) return { ok: false, reason: 'collinear' };
  const a = (syy * sxX - sxy * syX) / det;
  const b = (sxx * syX - sxy * sxX) / det;
  const c = (syy * sxY - sxy * syY) / det;
  const d = (sxx * syY - sxy * sxY) / det;
  const transform: Affine = { a, b, c, d, e: tx - a * mx - b * my, f: ty - c * mx - d * my };
  if (![a, b, c, d, transform.e, transform.f].every(Number.isFinite)) return { ok: false, reason: 'not-finite' };

  const residuals = pairs.map(({ from, to }) => {
    const p = applyAffine(transform, from);
    return Math.hypot(p.x - to.x, p.y - to.y);
  });
  const rmsResidual = Math.sqrt(residuals.reduce((s, r) => s + r * r, 0) / n);
  return {
    ok: true,
    fit: { transform, residuals, rmsResidual, maxResidual: Math.max(...residuals), degreesOfFreedom: 2 * n - 6 },
  };
}
