import { applyAffine, fitAffine, invertAffine, type Affine, type PlanePoint } from './affine';
import { axisCoordinate, axisValue, scaleWords, type AxisScale } from './axes';

/**
 * Calibration of a pictured map: which pixel shows which pair of axis values. The user clicks
 * reference points and types their values; a least-squares affine fit from the straight axis
 * coordinates (see axes.ts) to pixels then places every traced point. The fit's residual, in
 * pixels, shows a bad click at once: with four or more reference points they cannot all be fitted
 * exactly unless they agree.
 */

/** A clicked reference point: where it is in the picture and the axis values it stands for. */
export interface ReferencePoint {
  /** Image pixel, x to the right and y down from the top-left corner of the picture. */
  pixel: PlanePoint;
  /** The axis values there: horizontal (x) and vertical (y), in the axes' own units. */
  value: PlanePoint;
}

export interface AxisScales {
  x: AxisScale;
  y: AxisScale;
}

export interface Calibration {
  scales: AxisScales;
  /** Straight axis coordinates → image pixels. */
  toPixel: Affine;
  /** Image pixels → straight axis coordinates. */
  fromPixel: Affine;
  /** Per reference point: pixels between the click and where the fit puts the typed values. */
  residuals: number[];
  /** Root mean square of the residuals, pixels. */
  rmsResidual: number;
  /** The largest residual, pixels. */
  maxResidual: number;
  /** Reference equations beyond what the fit needs: 0 means nothing can be checked yet. */
  degreesOfFreedom: number;
}

/** A calibration problem; `index` is the reference point it is about (null: the whole set). */
export interface CalibrationProblem {
  index: number | null;
  message: string;
}

export type CalibrationResult = { ok: true; calibration: Calibration } | { ok: false; problems: CalibrationProblem[] };

/** Fewest reference points an affine fit needs (six unknowns, two equations per point). */
export const MIN_REFERENCE_POINTS = 3;

/**
 * Fits the calibration from reference points. Refuses, with every reason, when there are fewer
 * than three points, when a value cannot be on its axis (zero or negative on a logarithmic axis),
 * when the typed values lie on one line, or when the clicks do.
 */
export function calibrate(points: readonly ReferencePoint[], scales: AxisScales): CalibrationResult {
  const problems: CalibrationProblem[] = [];
  const pairs: { from: PlanePoint; to: PlanePoint }[] = [];
  points.forEach((point, index) => {
    if (!Number.isFinite(point.pixel.x) || !Number.isFinite(point.pixel.y)) {
      problems.push({ index, message: 'the click is not a place in the picture' });
      return;
    }
    const u = axisCoordinate(point.value.x, scales.x);
    const v = axisCoordinate(point.value.y, scales.y);
    if (u === null) problems.push({ index, message: valueProblem('horizontal', point.value.x, scales.x) });
    if (v === null) problems.push({ index, message: valueProblem('vertical', point.value.y, scales.y) });
    if (u !== null && v !== null) pairs.push({ from: { x: u, y: v }, to: point.pixel });
  });
  if (problems.length > 0) return { ok: false, problems };
  if (pairs.length < MIN_REFERENCE_POINTS) {
    return {
      ok: false,
      problems: [{ index: null, message: `place at least ${MIN_REFERENCE_POINTS} reference points (${pairs.length} so far): two on each axis is usual` }],
    };
  }
  const result = fitAffine(pairs);
  if (!result.ok) {
    const message =
      result.reason === 'collinear'
        ? 'the typed values of the reference points lie on one line, so they fix only one direction: use points on both axes (or give the axes’ crossing values)'
        : 'the reference points could not be fitted';
    return { ok: false, problems: [{ index: null, message }] };
  }
  const fromPixel = invertAffine(result.fit.transform);
  if (fromPixel === null) {
    return {
      ok: false,
      problems: [{ index: null, message: 'the clicks lie on one line in the picture, so they cannot place both axes: click points on both axes' }],
    };
  }
  const { transform, residuals, rmsResidual, maxResidual, degreesOfFreedom } = result.fit;
  return { ok: true, calibration: { scales, toPixel: transform, fromPixel, residuals, rmsResidual, maxResidual, degreesOfFreedom } };
}

function valueProblem(axis: 'horizontal' | 'vertical', value: number, scale: AxisScale): string {
  if (!Number.isFinite(value)) return `the ${axis} value is missing or not a number`;
  return `the ${axis} value ${value} cannot be on a ${scaleWords(scale)} axis: it must be above zero`;
}

/** The axis values shown at an image pixel. */
export function pixelToData(calibration: Calibration, pixel: PlanePoint): PlanePoint {
  const straight = applyAffine(calibration.fromPixel, pixel);
  return { x: axisValue(straight.x, calibration.scales.x), y: axisValue(straight.y, calibration.scales.y) };
}

/** The image pixel showing a pair of axis values; null when a value cannot be on its axis. */
export function dataToPixel(calibration: Calibration, value: PlanePoint): PlanePoint | null {
  const u = axisCoordinate(value.x, calibration.scales.x);
  const v = axisCoordinate(value.y, calibration.scales.y);
  if (u === null || v === null) return null;
  return applyAffine(calibration.toPixel, { x: u, y: v });
}

// ------------------------------------------------------------------------------------------------
// Reference points as the Tracer asks for them: clicks on an axis carry one typed value each, and
// the values where the axes cross supply the other.

export const REFERENCE_ROLES = ['x-axis', 'y-axis', 'crossing', 'point'] as const;
/**
 * `x-axis`: a click on the horizontal axis (its x typed); `y-axis`: on the vertical axis;
 * `crossing`: the corner where the axes cross (both values are the crossing's); `point`: anywhere,
 * both values typed.
 */
export type ReferenceRole = (typeof REFERENCE_ROLES)[number];

export interface ReferenceClick {
  role: ReferenceRole;
  /** Image pixel; null while not placed yet. */
  pixel: PlanePoint | null;
  /** Horizontal axis value (typed for `x-axis` and `point` clicks). */
  x: number | null;
  /** Vertical axis value (typed for `y-axis` and `point` clicks). */
  y: number | null;
}

/** Where the drawn axes cross: the horizontal axis line sits at vertical value `y`, the vertical axis line at horizontal value `x`. */
export interface AxesCrossing {
  x: number | null;
  y: number | null;
}

/**
 * Turns the clicks into reference points: a click on the horizontal axis lies on the line where
 * the vertical value is the crossing's `y`, and likewise for the vertical axis. Clicks not placed
 * yet are left out; a placed click without the values it needs is a problem naming it.
 */
export function referencePoints(
  clicks: readonly ReferenceClick[],
  crossing: AxesCrossing,
): { points: ReferencePoint[]; indexes: number[]; problems: CalibrationProblem[] } {
  const points: ReferencePoint[] = [];
  const indexes: number[] = [];
  const problems: CalibrationProblem[] = [];
  clicks.forEach((click, index) => {
    if (click.pixel === null) return;
    const xFromCrossing = click.role === 'y-axis' || click.role === 'crossing';
    const yFromCrossing = click.role === 'x-axis' || click.role === 'crossing';
    const x = xFromCrossing ? crossing.x : click.x;
    const y = yFromCrossing ? crossing.y : click.y;
    if (x === null || !Number.isFinite(x)) {
      problems.push({
        index: xFromCrossing ? null : index,
        message: xFromCrossing ? 'type the horizontal value where the axes cross (clicks on the vertical axis take it)' : 'type this point’s horizontal value',
      });
    }
    if (y === null || !Number.isFinite(y)) {
      problems.push({
        index: yFromCrossing ? null : index,
        message: yFromCrossing ? 'type the vertical value where the axes cross (clicks on the horizontal axis take it)' : 'type this point’s vertical value',
      });
    }
    if (x !== null && y !== null && Number.isFinite(x) && Number.isFinite(y)) {
      points.push({ pixel: click.pixel, value: { x, y } });
      indexes.push(index);
    }
  });
  // One missing crossing value is one problem, however many clicks need it.
  const seen = new Set<string>();
  const unique = problems.filter((p) => {
    const key = `${p.index}|${p.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
  return { points, indexes, problems: unique };
}

/**
 * The whole calibration step: clicks and crossing values in, a calibration (with each residual
 * placed back on its click) or every problem out, each naming its click by index.
 */
export function calibrateClicks(
  clicks: readonly ReferenceClick[],
  crossing: AxesCrossing,
  scales: AxisScales,
): { result: CalibrationResult; residualsByClick: (number | null)[] } {
  const { points, indexes, problems } = referencePoints(clicks, crossing);
  const residualsByClick: (number | null)[] = clicks.map(() => null);
  if (problems.length > 0) return { result: { ok: false, problems }, residualsByClick };
  const result = calibrate(points, scales);
  if (!result.ok) {
    return { result: { ok: false, problems: result.problems.map((p) => ({ ...p, index: p.index === null ? null : indexes[p.index] })) }, residualsByClick };
  }
  result.calibration.residuals.forEach((r, i) => (residualsByClick[indexes[i]] = r));
  return { result, residualsByClick };
}
