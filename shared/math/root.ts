/**
 * Root finding on a bracket: Brent's method (R. P. Brent, Algorithms for Minimization without
 * Derivatives, 1973, ch. 4, the "zeroin" procedure). It keeps a sign change inside [a, b] at
 * every step, takes inverse-quadratic or secant steps when they are safe and bisects when not,
 * so it converges like the secant method on smooth functions and never worse than bisection.
 *
 * It always terminates (an iteration cap), never returns NaN, and says why when it fails: no
 * sign change at the ends, a non-finite function value, or the cap reached.
 */

export interface RootOptions {
  /** Stop when the bracket is narrower than this, in the units of x (default 1e-12). */
  absoluteTolerance?: number;
  /** Plus this share of |x| (default 1e-12). */
  relativeTolerance?: number;
  /**
   * Also stop as soon as |f(x)| is at most this (default 0: only an exact zero). For costly
   * functions whose value, not x, is what must be close: it spares the last steps that only
   * narrow the bracket.
   */
  functionTolerance?: number;
  /** Most function evaluations after the two ends (default 100). */
  maxIterations?: number;
  /** f(a), when the caller already has it (saves one evaluation). */
  fa?: number;
  /** f(b), when the caller already has it. */
  fb?: number;
}

export type RootResult =
  | {
      ok: true;
      /** The root found, within the tolerance. */
      x: number;
      /** f(x). */
      fx: number;
      /** Function evaluations spent inside the bracket (the ends not counted). */
      iterations: number;
    }
  | {
      ok: false;
      /** Plain words: why no root was found. */
      reason: string;
      iterations: number;
      /**
       * The last bracket that still held a sign change, when there was one (a cap reached or a
       * non-finite value inside). `a` and `b` are its ends with their function values.
       */
      bracket?: { a: number; fa: number; b: number; fb: number };
    };

const EPSILON = Number.EPSILON;

function fmtNumber(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(6))) : String(x);
}

/** A root of f between a and b, where f(a) and f(b) have opposite signs (or one of them is 0). */
export function findRoot(f: (x: number) => number, a: number, b: number, options: RootOptions = {}): RootResult {
  const absTol = options.absoluteTolerance ?? 1e-12;
  const relTol = options.relativeTolerance ?? 1e-12;
  const maxIterations = options.maxIterations ?? 100;
  const fTol = options.functionTolerance ?? 0;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return { ok: false, reason: `the bracket [${fmtNumber(a)}, ${fmtNumber(b)}] is not finite`, iterations: 0 };
  if (!(absTol >= 0) || !(relTol >= 0) || !(fTol >= 0) || !(maxIterations >= 1))
    return { ok: false, reason: 'the tolerances must be 0 or more and the iteration cap at least 1', iterations: 0 };
  let fa = options.fa ?? f(a);
  let fb = options.fb ?? f(b);
  if (!Number.isFinite(fa)) return { ok: false, reason: `the function is not finite at ${fmtNumber(a)}`, iterations: 0 };
  if (!Number.isFinite(fb)) return { ok: false, reason: `the function is not finite at ${fmtNumber(b)}`, iterations: 0 };
  if (Math.abs(fb) <= fTol) return { ok: true, x: b, fx: fb, iterations: 0 };
  if (Math.abs(fa) <= fTol) return { ok: true, x: a, fx: fa, iterations: 0 };
  if (fa > 0 === fb > 0) {
    return { ok: false, reason: `no sign change between ${fmtNumber(a)} and ${fmtNumber(b)} (f = ${fmtNumber(fa)} and ${fmtNumber(fb)})`, iterations: 0 };
  }

  // b is the best estimate, a the previous one, c the far end of the bracket [b, c].
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iterations = 1; iterations <= maxIterations + 1; iterations++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * EPSILON * Math.abs(b) + 0.5 * (absTol + relTol * Math.abs(b));
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || Math.abs(fb) <= fTol) return { ok: true, x: b, fx: fb, iterations: iterations - 1 };
    if (iterations > maxIterations) {
      return {
        ok: false,
        reason: `no convergence in ${maxIterations} iterations (bracket ${fmtNumber(b)} to ${fmtNumber(c)})`,
        iterations: maxIterations,
        bracket: { a: b, fa: fb, b: c, fb: fc },
      };
    }
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // Interpolate: secant when only two points are known, inverse quadratic with three.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      // Accept the step only when it falls well inside the bracket and shrinks fast enough.
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) {
      return { ok: false, reason: `the function is not finite at ${fmtNumber(b)}`, iterations, bracket: { a, fa, b: c, fb: fc } };
    }
  }
  // Unreachable: the loop returns by its last pass.
  return { ok: false, reason: 'no convergence', iterations: maxIterations };
}
