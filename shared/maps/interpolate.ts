import { Delaunay } from 'd3-delaunay';

/**
 * Piecewise-linear interpolation of scattered map points: a Delaunay triangulation (d3-delaunay)
 * of the points, and barycentric weights inside the triangle that holds the query point. The
 * method reproduces any plane exactly, returns the data at the data points, and converges as
 * O(h²) for smooth surfaces (h the triangle size). Outside the convex hull of the points it
 * returns null: a map is never extrapolated.
 *
 * The points are scaled to the unit square before triangulating, so that flow in kg/s and
 * pressure ratio (numbers of very different size) give well-shaped triangles, and so that one map
 * written in different units triangulates the same way.
 *
 * The points are triangulated in one canonical order (by x, then y, then the channels' values),
 * never in the order they were given: where four points lie on one circle there are two Delaunay
 * triangulations, and where two points coincide only one of them is kept, and which one depends
 * on the order the points arrive in. Sorted first, the same points always give the same triangles
 * and the same values, bit for bit.
 */
export interface TriangulatedSurface {
  readonly pointCount: number;
  readonly triangleCount: number;
  /** Index of a triangle holding (x, y), or -1 when the point is outside the convex hull. */
  findTriangle(x: number, y: number): number;
  /** The value of `channel` at (x, y) by barycentric interpolation; null outside the convex hull. */
  valueAt(x: number, y: number, channel?: number): number | null;
}

/** Barycentric weights more negative than this (in unit-square coordinates) mean "outside". */
const INSIDE_TOLERANCE = -1e-12;

/** The affine map of the points' bounding box onto the unit square: u = (x − xMin)·xScale, v = (y − yMin)·yScale. */
export interface UnitSquare {
  xMin: number;
  yMin: number;
  xScale: number;
  yScale: number;
}

/** The unit square `triangulate` works in (a side of zero length is left unscaled). */
export function unitSquare(xs: ArrayLike<number>, ys: ArrayLike<number>): UnitSquare {
  let xMin = Infinity,
    xMax = -Infinity,
    yMin = Infinity,
    yMax = -Infinity;
  for (let i = 0; i < xs.length; i++) {
    xMin = Math.min(xMin, xs[i]);
    xMax = Math.max(xMax, xs[i]);
    yMin = Math.min(yMin, ys[i]);
    yMax = Math.max(yMax, ys[i]);
  }
  return { xMin, yMin, xScale: xMax > xMin ? 1 / (xMax - xMin) : 1, yScale: yMax > yMin ? 1 / (yMax - yMin) : 1 };
}

/** Point indices sorted by x, then y, then each channel's value: the same for any order of the same points. */
function canonicalOrder(xs: ArrayLike<number>, ys: ArrayLike<number>, channels: ArrayLike<number>[]): number[] {
  // A plain array: its sort takes nearly sorted input (as merged map points come) in close to linear time.
  const order = new Array<number>(xs.length);
  for (let i = 0; i < order.length; i++) order[i] = i;
  return order.sort((a, b) => {
    const byPlace = xs[a] - xs[b] || ys[a] - ys[b];
    if (byPlace !== 0) return byPlace;
    for (const c of channels) if (c[a] !== c[b]) return c[a] - c[b];
    return 0;
  });
}

export function triangulate(xs: ArrayLike<number>, ys: ArrayLike<number>, channels: ArrayLike<number>[]): TriangulatedSurface {
  const n = xs.length;
  if (ys.length !== n || channels.some((c) => c.length !== n)) {
    throw new Error('triangulate: x, y and every channel must have one value per point');
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(xs[i]) || !Number.isFinite(ys[i]) || channels.some((c) => !Number.isFinite(c[i]))) {
      throw new Error(`triangulate: point ${i} has a value that is not a finite number`);
    }
  }
  const { xMin, yMin, xScale, yScale } = unitSquare(xs, ys);
  const order = canonicalOrder(xs, ys, channels);
  const u = new Float64Array(n);
  const v = new Float64Array(n);
  const coords = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    u[i] = (xs[order[i]] - xMin) * xScale;
    v[i] = (ys[order[i]] - yMin) * yScale;
    coords[2 * i] = u[i];
    coords[2 * i + 1] = v[i];
  }
  const values = channels.map((c) => Float64Array.from(order, (i) => c[i]));

  const delaunay = n >= 3 ? new Delaunay(coords) : null;
  // d3-delaunay jitters collinear input to triangulate it; such slivers carry no area to interpolate in.
  const usable = delaunay !== null && !(delaunay as unknown as { collinear?: unknown }).collinear;
  const triangles = usable ? delaunay.triangles : new Uint32Array(0);
  const halfedges = usable ? delaunay.halfedges : new Int32Array(0);
  const triangleCount = triangles.length / 3;

  // Per triangle (a, b, c): the origin c and the inverse of [a−c, b−c], so that two products give
  // the weights of a and b; the weight of c is what is left.
  const geometry = new Float64Array(6 * triangleCount);
  const degenerate = new Uint8Array(triangleCount);
  for (let t = 0; t < triangleCount; t++) {
    const a = triangles[3 * t],
      b = triangles[3 * t + 1],
      c = triangles[3 * t + 2];
    const det = (v[b] - v[c]) * (u[a] - u[c]) + (u[c] - u[b]) * (v[a] - v[c]);
    const g = 6 * t;
    geometry[g] = u[c];
    geometry[g + 1] = v[c];
    if (!(Math.abs(det) > 1e-300) || !Number.isFinite(1 / det)) {
      degenerate[t] = 1;
      continue;
    }
    geometry[g + 2] = (v[b] - v[c]) / det;
    geometry[g + 3] = (u[c] - u[b]) / det;
    geometry[g + 4] = (v[c] - v[a]) / det;
    geometry[g + 5] = (u[a] - u[c]) / det;
  }

  // A coarse grid of starting triangles keeps every walk a few steps long, wherever the query lands.
  const gridSide = Math.max(4, Math.min(256, Math.ceil(Math.sqrt(triangleCount))));
  const gridStart = new Int32Array(gridSide * gridSide).fill(-1);
  if (usable && triangleCount > 0) {
    const inedges = delaunay.inedges;
    for (let gy = 0; gy < gridSide; gy++) {
      for (let gx = 0; gx < gridSide; gx++) {
        const nearest = delaunay.find((gx + 0.5) / gridSide, (gy + 0.5) / gridSide);
        let edge = inedges[nearest];
        if (edge === -1) edge = delaunay.hull.length > 0 ? findEdgeOfPoint(triangles, nearest) : -1;
        gridStart[gy * gridSide + gx] = edge >= 0 ? Math.floor(edge / 3) : 0;
      }
    }
  }

  const weights = new Float64Array(3);
  function weighAt(t: number, pu: number, pv: number): boolean {
    const g = 6 * t;
    const du = pu - geometry[g];
    const dv = pv - geometry[g + 1];
    weights[0] = geometry[g + 2] * du + geometry[g + 3] * dv;
    weights[1] = geometry[g + 4] * du + geometry[g + 5] * dv;
    weights[2] = 1 - weights[0] - weights[1];
    return weights[0] >= INSIDE_TOLERANCE && weights[1] >= INSIDE_TOLERANCE && weights[2] >= INSIDE_TOLERANCE;
  }

  function bruteForce(pu: number, pv: number): number {
    for (let t = 0; t < triangleCount; t++) if (!degenerate[t] && weighAt(t, pu, pv)) return t;
    return -1;
  }

  // The edge opposite each vertex of triangle t: vertex 0 faces edge 3t+1, 1 faces 3t+2, 2 faces 3t.
  const OPPOSITE = [1, 2, 0];

  /** Visibility walk: step across the edge the point lies beyond until a triangle holds it. */
  function locate(pu: number, pv: number): number {
    if (triangleCount === 0) return -1;
    const gx = Math.min(gridSide - 1, Math.max(0, Math.floor(pu * gridSide)));
    const gy = Math.min(gridSide - 1, Math.max(0, Math.floor(pv * gridSide)));
    let t = gridStart[gy * gridSide + gx];
    for (let step = 0; step <= triangleCount; step++) {
      if (degenerate[t]) return bruteForce(pu, pv);
      if (weighAt(t, pu, pv)) return t;
      let worst = 0;
      if (weights[1] < weights[worst]) worst = 1;
      if (weights[2] < weights[worst]) worst = 2;
      const across = halfedges[3 * t + OPPOSITE[worst]];
      // Beyond a hull edge: the hull is convex, so the point is outside it.
      if (across === -1) return -1;
      t = Math.floor(across / 3);
    }
    return bruteForce(pu, pv);
  }

  return {
    pointCount: n,
    triangleCount,
    findTriangle(x, y) {
      if (!Number.isFinite(x) || !Number.isFinite(y)) return -1;
      return locate((x - xMin) * xScale, (y - yMin) * yScale);
    },
    valueAt(x, y, channel = 0) {
      if (!Number.isFinite(x) || !Number.isFinite(y)) return null;
      const data = values[channel];
      if (!data) throw new Error(`triangulate: no channel ${channel}`);
      const pu = (x - xMin) * xScale;
      const pv = (y - yMin) * yScale;
      const t = locate(pu, pv);
      if (t === -1) return null;
      weighAt(t, pu, pv);
      const a = triangles[3 * t],
        b = triangles[3 * t + 1],
        c = triangles[3 * t + 2];
      // Written around vertex c so that a plane comes back exactly up to rounding.
      return data[c] + weights[0] * (data[a] - data[c]) + weights[1] * (data[b] - data[c]);
    },
  };
}

function findEdgeOfPoint(triangles: Uint32Array, point: number): number {
  return triangles.indexOf(point);
}
