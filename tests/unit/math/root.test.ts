import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findRoot } from '#shared/math/root';
import { expectClose } from '../expect-close';

const ok = (r: ReturnType<typeof findRoot>) => {
  if (!r.ok) throw new Error(r.reason);
  return r;
};

describe("Brent's method on a bracket", () => {
  it('finds closed-form roots', () => {
    expectClose(ok(findRoot((x) => x * x - 2, 0, 2)).x, Math.SQRT2, 1e-12); // √2 (closed form)
    expectClose(ok(findRoot((x) => Math.exp(x) - 5, 0, 3)).x, Math.log(5), 1e-12); // ln 5 (closed form)
    expectClose(ok(findRoot((x) => x * x * x - 8, -1, 5)).x, 2, 1e-12); // ∛8 = 2 (closed form)
    expectClose(ok(findRoot((x) => Math.cos(x), 1, 2)).x, Math.PI / 2, 1e-12); // cos x = 0 at π/2 (closed form)
    expectClose(ok(findRoot((x) => 3 * x - 1, 0, 1)).x, 1 / 3, 1e-12); // a straight line: exact by the secant step (definition)
  });

  it('works on a bracket given either way round, and takes a root at an end as it is', () => {
    expectClose(ok(findRoot((x) => x * x - 2, 2, 0)).x, Math.SQRT2, 1e-12); // √2 (closed form)
    expect(ok(findRoot((x) => x - 1, 1, 3))).toMatchObject({ x: 1, iterations: 0 }); // f(a) = 0 exactly (definition)
    expect(ok(findRoot((x) => x - 3, 1, 3))).toMatchObject({ x: 3, iterations: 0 }); // f(b) = 0 exactly (definition)
  });

  it('uses known end values instead of evaluating them', () => {
    let calls = 0;
    const f = (x: number) => {
      calls++;
      return x * x - 2;
    };
    const r = ok(findRoot(f, 0, 2, { fa: -2, fb: 2 }));
    expectClose(r.x, Math.SQRT2, 1e-12); // √2 (closed form)
    expect(calls).toBe(r.iterations); // the ends were not evaluated again (definition of the option)
  });

  it('stops early on the function tolerance', () => {
    const strict = ok(findRoot((x) => x * x - 2, 0, 2));
    const loose = ok(findRoot((x) => x * x - 2, 0, 2, { functionTolerance: 1e-3 }));
    expect(Math.abs(loose.fx)).toBeLessThanOrEqual(1e-3); // the stated tolerance (definition)
    expect(loose.iterations).toBeLessThan(strict.iterations); // fewer steps for a looser goal (definition)
  });

  it('reports, never throws or returns NaN, when there is no root to find', () => {
    const none = findRoot((x) => x * x + 1, -1, 1);
    expect(none.ok).toBe(false); // x² + 1 > 0 everywhere (closed form)
    if (!none.ok) expect(none.reason).toMatch(/no sign change/);
    const nan = findRoot((x) => (x > 0.5 ? Number.NaN : -1), 0, 1);
    expect(nan.ok).toBe(false); // NaN at an end (definition)
    const inside = findRoot((x) => (x > 0.2 && x < 0.9 ? Number.NaN : x - 0.5), 0, 1);
    expect(inside.ok).toBe(false); // NaN met inside the bracket (definition)
    if (!inside.ok) expect(inside.bracket).toBeDefined();
    expect(findRoot((x) => x, Number.NaN, 1).ok).toBe(false); // a bracket end that is not a number (definition)
    expect(findRoot((x) => x, 0, Infinity).ok).toBe(false); // an infinite bracket (definition)
  });

  it('stops at the iteration cap and says so, keeping the bracket', () => {
    const r = findRoot((x) => x * x - 2, 0, 2, { maxIterations: 2, absoluteTolerance: 0, relativeTolerance: 0 });
    expect(r.ok).toBe(false); // two steps cannot reach machine precision from a bracket 2 wide (definition of the cap)
    if (!r.ok) {
      expect(r.reason).toMatch(/2 iterations/);
      expect(r.iterations).toBe(2);
      expect(Math.sign(r.bracket!.fa)).not.toBe(Math.sign(r.bracket!.fb)); // still a sign change (invariant of the method)
    }
  });

  it('terminates on a step function, at the step', () => {
    const r = ok(findRoot((x) => (x < 1 / 3 ? -1 : 1), 0, 1, { absoluteTolerance: 1e-9 }));
    expect(Math.abs(r.x - 1 / 3)).toBeLessThanOrEqual(1e-9); // the sign change sits at 1/3 (definition)
  });

  it('finds the root of any monotone cubic on any bracket around it (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        (root, below, above, k) => {
          // (x − r)·(1 + k·(x − r)²) is increasing with its only root at r (closed form).
          const f = (x: number) => (x - root) * (1 + k * (x - root) * (x - root));
          const r = findRoot(f, root - below, root + above, { absoluteTolerance: 1e-9, relativeTolerance: 1e-12 });
          expect(r.ok).toBe(true);
          if (r.ok) {
            expect(Number.isFinite(r.x)).toBe(true);
            expect(Math.abs(r.x - root)).toBeLessThanOrEqual(1e-8 + 1e-11 * Math.abs(root)); // within the tolerance asked (definition)
          }
        },
      ),
    );
  });
});
