import { unitSquare } from './interpolate';

/**
 * Coincident map points: one place on a map that carries two or more values. Digitised and
 * generated maps have them where an efficiency island is clipped onto the surge line (so that
 * several islands share the surge line's points) and where a speed line ends on an island. A
 * triangulation keeps only one point per place, and which one depends on the order of the file's
 * rows; the rule below decides instead, the same for every order.
 *
 * Two points are at one place when their flow and their pressure ratio both differ by at most
 * COINCIDENCE_TOLERANCE in the unit square the triangulation works in (the bounding box of the
 * points that carry the value, scaled to 1 × 1). Places are joined through shared points (single
 * linkage), so a chain of points each within the tolerance of the next is one place. The value
 * at a place is:
 *
 *  1. a speed line's value where one or more speed lines' points are there: the mean of their
 *     values. A speed line's point is a measured test point; an island is a contour drawn through
 *     the measurements, so the measurement wins;
 *  2. otherwise, where only islands meet: the highest island's efficiency. Islands are nested
 *     contours: the region inside the e-island holds the points whose efficiency is at least e.
 *     Two contours of different efficiencies can only share a point where both were cut off by
 *     the same edge (the surge line), and such a point belongs to every island through it, so its
 *     efficiency is at least the highest of them. The highest is the one value that agrees with
 *     every island drawn; their mean would put the point outside the highest island.
 *
 * The merged point stands where the place's first point (lowest flow, then lowest pressure ratio)
 * stands: within the tolerance of all the others. Means are summed in ascending order, so that even
 * the last bit of a value does not depend on the order of the points.
 */

/** Places closer than this, in the unit square of the points, are one place: far below a digitised map's resolution (about 1e-3), far above rounding (1e-16). */
export const COINCIDENCE_TOLERANCE = 1e-9;

/** What a point's value comes from: a speed line's test point, or an efficiency island's contour. */
export type PointSource = 'speed-line' | 'island';

export interface SurfacePoint {
  /** Corrected mass flow, kg/s. */
  correctedMassFlow: number;
  pressureRatio: number;
  /** The value the point carries (efficiency as a fraction, or shaft speed in rpm). */
  value: number;
  source: PointSource;
}

/** A place where points with different values met, and the value the rule gave it. */
export interface CoincidentPlace {
  /** Indices of the input points at this place, ascending. */
  points: number[];
  value: number;
}

export interface MergedPoints {
  /** One point per place, in one order for any order of the input (by flow in columns one tolerance wide, then pressure ratio). */
  correctedMassFlow: number[];
  pressureRatio: number[];
  value: number[];
  /** The places whose points carried different values, in the order of `correctedMassFlow`. */
  conflicts: CoincidentPlace[];
}

/** Merges coincident points by the rule above; the result is the same for any order of `points`. */
export function mergeCoincidentPoints(points: readonly SurfacePoint[]): MergedPoints {
  const { root, order: placesOrder } = placesOf(points);
  // Each place's points (only for places of two or more), and where it stands: its first point by flow, then PR.
  const members = new Map<number, number[]>();
  const standsAt = Int32Array.from(indices(points.length));
  for (let i = 0; i < points.length; i++) {
    const r = root[i];
    if (r === i) continue;
    const list = members.get(r);
    if (list) list.push(i);
    else members.set(r, [r, i]);
    if (lessByPlace(points[i], points[standsAt[r]])) standsAt[r] = i;
  }
  const merged: MergedPoints = { correctedMassFlow: [], pressureRatio: [], value: [], conflicts: [] };
  for (const at of placesOrder) {
    if (standsAt[root[at]] !== at) continue;
    const together = members.get(root[at]);
    const value = together ? valueOfPlace(points, together) : points[at].value;
    merged.correctedMassFlow.push(points[at].correctedMassFlow);
    merged.pressureRatio.push(points[at].pressureRatio);
    merged.value.push(value);
    if (together && together.some((k) => points[k].value !== points[together[0]].value)) merged.conflicts.push({ points: together, value });
  }
  return merged;
}

/** The rule: the mean of the speed lines' values where there are any, else the highest island's. */
function valueOfPlace(points: readonly SurfacePoint[], together: number[]): number {
  const measured = together.filter((i) => points[i].source === 'speed-line').map((i) => points[i].value);
  if (measured.length === 0) return Math.max(...together.map((i) => points[i].value));
  measured.sort((a, b) => a - b);
  let sum = 0;
  for (const x of measured) sum += x;
  return sum / measured.length;
}

function lessByPlace(a: SurfacePoint, b: SurfacePoint): boolean {
  return a.correctedMassFlow < b.correctedMassFlow || (a.correctedMassFlow === b.correctedMassFlow && a.pressureRatio < b.pressureRatio);
}

/**
 * For each point, the smallest index among the points of its place (union–find). With u and v the
 * flow and pressure ratio scaled to the unit square, the points are sorted into columns one
 * tolerance wide (by u) and by v inside a column; a point's partners lie in its own column or the
 * next, within a tolerance of its v, so each point looks only at its near neighbours.
 */
function placesOf(points: readonly SurfacePoint[]): { root: Int32Array; order: number[] } {
  const n = points.length;
  const u = new Float64Array(n);
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    u[i] = points[i].correctedMassFlow;
    v[i] = points[i].pressureRatio;
  }
  const square = unitSquare(u, v);
  const column = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    u[i] = (u[i] - square.xMin) * square.xScale;
    v[i] = (v[i] - square.yMin) * square.yScale;
    column[i] = Math.floor(u[i] / COINCIDENCE_TOLERANCE);
  }
  const order = indices(n).sort((a, b) => column[a] - column[b] || v[a] - v[b]);
  const parent = Int32Array.from(indices(n));
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  const join = (i: number, j: number) => {
    const [a, b] = [find(i), find(j)];
    if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
  };
  const near = (i: number, j: number) => Math.abs(u[j] - u[i]) <= COINCIDENCE_TOLERANCE && Math.abs(v[j] - v[i]) <= COINCIDENCE_TOLERANCE;
  // columnEnd[k]: the position after the last point of the column holding position k.
  const columnEnd = new Int32Array(n);
  for (let k = n - 1; k >= 0; k--) columnEnd[k] = k + 1 < n && column[order[k + 1]] === column[order[k]] ? columnEnd[k + 1] : k + 1;
  for (let k = 0; k < n; k++) {
    const i = order[k];
    const end = columnEnd[k];
    // Its own column, where v rises: the points up to a tolerance above.
    for (let m = k + 1; m < end && v[order[m]] - v[i] <= COINCIDENCE_TOLERANCE; m++) if (near(i, order[m])) join(i, order[m]);
    if (end === n || column[order[end]] !== column[i] + 1) continue;
    // The next column: from the first point at v ≥ v_i − tolerance (binary search) to a tolerance above.
    let low = end;
    const high = columnEnd[end];
    for (let span = high - low; span > 0;) {
      const half = span >> 1;
      if (v[order[low + half]] < v[i] - COINCIDENCE_TOLERANCE) {
        low += half + 1;
        span -= half + 1;
      } else span = half;
    }
    for (let m = low; m < high && v[order[m]] - v[i] <= COINCIDENCE_TOLERANCE; m++) if (near(i, order[m])) join(i, order[m]);
  }
  for (let i = 0; i < n; i++) parent[i] = find(i);
  return { root: parent, order };
}

/** 0, 1, …, n − 1 as a plain array (sorted by Array.prototype.sort, which is fast on nearly sorted input). */
function indices(n: number): number[] {
  const list = new Array<number>(n);
  for (let i = 0; i < n; i++) list[i] = i;
  return list;
}
