import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { triangulate } from '#shared/maps';
import { expectClose } from '../expect-close';

/** A fixed, well-spread point set: a jittered grid (deterministic, no randomness). */
function jitteredGrid(n: number, x0: number, x1: number, y0: number, y1: number): { xs: number[]; ys: number[] } {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const inner = i > 0 && i < n - 1 && j > 0 && j < n - 1;
      const jitterX = inner ? 0.3 * Math.sin(7.1 * i + 3.3 * j) : 0;
      const jitterY = inner ? 0.3 * Math.cos(5.7 * i - 2.9 * j) : 0;
      xs.push(x0 + ((i + jitterX) / (n - 1)) * (x1 - x0));
      ys.push(y0 + ((j + jitterY) / (n - 1)) * (y1 - y0));
    }
  }
  return { xs, ys };
}

const plane = (x: number, y: number) => 0.52 + 1.7 * x - 0.09 * y; // efficiency = a + b·flow + c·PR

describe('barycentric interpolation over a Delaunay triangulation', () => {
  it('reproduces a plane exactly at any point inside the map', () => {
    // flows in kg/s and pressure ratios, numbers of very different size, as on a real map
    const { xs, ys } = jitteredGrid(9, 0.02, 0.3, 1.05, 3.6);
    const surface = triangulate(xs, ys, [xs.map((x, i) => plane(x, ys[i]))]);
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 0.3, noNaN: true }), fc.double({ min: 1.05, max: 3.6, noNaN: true }), (x, y) => {
        // exact up to floating-point rounding: barycentric weights reproduce linear functions (definition)
        expectClose(surface.valueAt(x, y), plane(x, y), 1e-12);
      }),
      { numRuns: 2000, seed: 20240601 },
    );
  });

  it('reproduces a plane on scattered points of any shape', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.tuple(fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 0, max: 1000 })), {
          minLength: 4,
          maxLength: 60,
          selector: ([x, y]) => `${x},${y}`,
        }),
        fc.tuple(fc.nat(1000), fc.nat(1000), fc.nat(1000)),
        (points, [wa, wb, wc]) => {
          const xs = points.map(([x]) => 0.01 + x * 3e-4);
          const ys = points.map(([, y]) => 1 + y * 3e-3);
          const surface = triangulate(xs, ys, [xs.map((x, i) => plane(x, ys[i]))]);
          if (surface.triangleCount === 0) return; // every point on one line: nothing to interpolate in
          // A convex combination of three data points lies inside their convex hull.
          const total = wa + wb + wc || 1;
          const [a, b, c] = [0, Math.floor(points.length / 2), points.length - 1];
          const x = (wa * xs[a] + wb * xs[b] + wc * xs[c]) / total;
          const y = (wa * ys[a] + wb * ys[b] + wc * ys[c]) / total;
          const value = surface.valueAt(x, y);
          if (value === null) {
            // only when the three points are collinear and the query sits on the hull's edge within rounding
            expect(surface.findTriangle(x, y)).toBe(-1);
            return;
          }
          expectClose(value, plane(x, y), 1e-9);
        },
      ),
      { numRuns: 300, seed: 7 },
    );
  });

  it('returns the data at the data points', () => {
    const { xs, ys } = jitteredGrid(7, 0.05, 0.4, 1.1, 3.2);
    const values = xs.map((x, i) => Math.sin(9 * x) + ys[i] ** 2);
    const surface = triangulate(xs, ys, [values]);
    for (let i = 0; i < xs.length; i++) expectClose(surface.valueAt(xs[i], ys[i]), values[i], 1e-12);
  });

  it('converges on a smooth surface as points are added (error falls about 4× per halving of spacing)', () => {
    const smooth = (x: number, y: number) => Math.exp(-((x - 0.55) ** 2) * 6 - (y - 0.45) ** 2 * 4) + 0.3 * x * y;
    const queries: Array<[number, number]> = [];
    for (let i = 0; i < 40; i++) for (let j = 0; j < 40; j++) queries.push([0.01 + (i + 0.37) / 41, 0.01 + (j + 0.61) / 41]);
    const maxError = (n: number) => {
      const { xs, ys } = jitteredGrid(n, 0, 1, 0, 1);
      const surface = triangulate(xs, ys, [xs.map((x, i) => smooth(x, ys[i]))]);
      return Math.max(...queries.map(([x, y]) => Math.abs(surface.valueAt(x, y)! - smooth(x, y))));
    };
    const errors = [5, 9, 17, 33].map(maxError);
    // Piecewise-linear interpolation of a smooth function has error O(h²) (standard result, from memory):
    // each halving of h should cut the error by about 4; demand at least 2.5 to leave room for jitter.
    for (let k = 1; k < errors.length; k++) expect(errors[k]).toBeLessThan(errors[k - 1] / 2.5);
  });

  it('never extrapolates: outside the convex hull there is no value', () => {
    const { xs, ys } = jitteredGrid(5, 0.1, 0.2, 1.5, 2.5);
    const surface = triangulate(xs, ys, [xs.map(() => 0.7)]);
    for (const [x, y] of [
      [0.09, 2],
      [0.21, 2],
      [0.15, 1.49],
      [0.15, 2.51],
      [0, 0],
      [Number.NaN, 2],
      [Number.POSITIVE_INFINITY, 2],
    ]) {
      expect(surface.valueAt(x, y)).toBeNull();
      expect(surface.findTriangle(x, y)).toBe(-1);
    }
    expect(surface.valueAt(0.1, 1.5)).toBe(0.7); // a corner point of the hull is inside
  });

  it('tells inside from outside the convex hull as its geometry does', () => {
    const { xs, ys } = jitteredGrid(12, 0, 1, 0, 1);
    const surface = triangulate(xs, ys, [xs]);
    fc.assert(
      fc.property(fc.double({ min: -0.2, max: 1.2, noNaN: true }), fc.double({ min: -0.2, max: 1.2, noNaN: true }), (x, y) => {
        // Points within rounding of the hull's edge may fall either way; the rest must not.
        const edgeDistance = Math.min(Math.abs(x), Math.abs(1 - x), Math.abs(y), Math.abs(1 - y));
        if (edgeDistance < 1e-9) return;
        const value = surface.valueAt(x, y);
        const inside = x > 0 && x < 1 && y > 0 && y < 1; // the hull of a grid with fixed edges is the unit square
        expect(value !== null).toBe(inside);
        if (value !== null) expectClose(value, x, 1e-9); // channel = x itself: a plane
      }),
      { numRuns: 3000, seed: 99 },
    );
  });

  it('gives the same triangles and values, bit for bit, for any order of the same points', () => {
    // A square grid: every cell's four corners lie on one circle, so it has two Delaunay
    // triangulations per cell (a textbook degenerate case), and two points given twice with
    // different values: a triangulation keeps one of each pair.
    const xs: number[] = [];
    const ys: number[] = [];
    const values: number[] = [];
    for (let i = 0; i < 6; i++) {
      for (let j = 0; j < 6; j++) {
        xs.push(0.05 + 0.04 * i);
        ys.push(1.2 + 0.5 * j);
        values.push(0.6 + 0.01 * ((i * 7 + j * 3) % 11)); // no plane: the diagonal chosen shows in the value
      }
    }
    xs.push(0.13, 0.17);
    ys.push(1.7, 2.2);
    values.push(0.5, 0.9);
    const probes: Array<[number, number]> = [];
    for (let i = 0; i <= 40; i++) for (let j = 0; j <= 40; j++) probes.push([0.04 + (0.23 * i) / 40, 1.1 + (2.7 * j) / 40]);
    const readAll = (order: number[]) => {
      const surface = triangulate(
        order.map((k) => xs[k]),
        order.map((k) => ys[k]),
        [order.map((k) => values[k])],
      );
      return probes.map(([x, y]) => surface.valueAt(x, y));
    };
    const indices = [...xs.keys()];
    const want = readAll(indices);
    fc.assert(
      fc.property(fc.shuffledSubarray(indices, { minLength: indices.length, maxLength: indices.length }), (order) => {
        const got = readAll(order);
        const differs = probes.findIndex((_, k) => got[k] !== want[k]); // identical (===), not close
        expect(differs === -1 ? null : `at ${probes[differs]}: ${want[differs]} became ${got[differs]}`).toBeNull();
      }),
      { numRuns: 200, seed: 5 },
    );
  });

  it('refuses points that are not finite numbers', () => {
    expect(() => triangulate([0, 1, Number.NaN], [0, 1, 2], [[1, 2, 3]])).toThrow(/point 2/);
    expect(() => triangulate([0, 1], [0, 1, 2], [[1, 2, 3]])).toThrow(/one value per point/);
  });
});
