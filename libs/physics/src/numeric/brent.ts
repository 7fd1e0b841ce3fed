/**
 * Brent's bracketing root finder (R. P. Brent, Algorithms for Minimization without Derivatives,
 * 1973, ch. 4): inverse quadratic interpolation and secant steps, falling back to bisection, so it
 * keeps the bracket's guarantee and converges superlinearly on smooth functions.
 */

/** Result of a root search. */
export interface RootResult {
  root: number;
  iterations: number;
  converged: boolean;
}

/**
 * Finds x in [a, b] with f(x) = 0, given f(a) and f(b) of opposite sign (or one of them zero).
 * Returns converged = false when the bracket is invalid or the iteration cap is hit.
 *
 * @param f function of one variable
 * @param a lower end of the bracket
 * @param b upper end of the bracket
 * @param tolerance absolute tolerance on x
 * @param maxIterations iteration cap
 */
export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  tolerance = 1e-12,
  maxIterations = 200,
): RootResult {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return { root: a, iterations: 0, converged: true };
  if (fb === 0) return { root: b, iterations: 0, converged: true };
  if (!(fa * fb < 0)) return { root: Number.NaN, iterations: 0, converged: false };
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 1; i <= maxIterations; i++) {
    if (fb * fc > 0) {
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
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { root: b, iterations: i, converged: true };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
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
  }
  return { root: b, iterations: maxIterations, converged: false };
}
