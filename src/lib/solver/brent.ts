/**
 * Bracketed root finding by Brent's method (inverse quadratic interpolation, secant and
 * bisection, never leaving the sign-change bracket).
 * Source: Brent, R. P., 1973, Algorithms for Minimization without Derivatives, ch. 4 ("zero").
 */

/** A scalar function of one variable. */
export type ScalarFunction = (x: number) => number;

/** Largest number of iterations before `brent` reports no convergence. */
export const BRENT_MAX_ITERATIONS = 200;

/**
 * Finds `x` in `[a, b]` with `f(x) = 0`, given `f(a)` and `f(b)` of opposite sign (or zero).
 * Converges when the bracket is narrower than `2·(4·ε·|x| + xTol/2)`.
 *
 * Returns `NaN` when the interval is not a verified sign-change bracket, when `f` returns
 * a non-finite value, or when it fails to converge: callers turn `NaN` into an error, never
 * into a silent wrong root. Allocation-free so it can run inside sweeps.
 *
 * @example brent((x) => x * x - 2, 0, 2, 1e-14) // ≈ 1.41421356
 */
export function brent(f: ScalarFunction, a: number, b: number, xTol: number): number {
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) return Number.NaN;
  if (fa === 0) return a;
  if (fb === 0) return b;
  if ((fa > 0) === (fb > 0)) return Number.NaN;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < BRENT_MAX_ITERATIONS; i++) {
    if ((fb > 0) === (fc > 0)) {
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
    const tol = 4 * Number.EPSILON * Math.abs(b) + 0.5 * xTol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // Interpolate: secant when only two points, inverse quadratic otherwise.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
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
    if (!Number.isFinite(fb)) return Number.NaN;
  }
  return Number.NaN;
}
