/**
 * Student's t distribution: CDF through the regularized incomplete beta function, and its
 * quantile by Brent's method (Numerical Recipes, 3rd ed., sections 6.1, 6.4 and 6.14).
 */
import { brentRoot } from './brent';

const LANCZOS = [
  76.18009172947146, -86.50532032941678, 24.01409824083091, -1.231739572450155,
  0.1208650973866179e-2, -0.5395239384953e-5,
];

/** ln Gamma(x) for x > 0 (Lanczos approximation, relative error below 2e-10). */
export function logGamma(x: number): number {
  let y = x;
  const tmp = x + 5.5 - (x + 0.5) * Math.log(x + 5.5);
  let ser = 1.000000000190015;
  for (const c of LANCZOS) ser += c / ++y;
  return -tmp + Math.log((2.5066282746310007 * ser) / x);
}

function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return h;
}

/** Regularized incomplete beta I_x(a, b). */
export function regularizedBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(
    logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x),
  );
  return x < (a + 1) / (a + b + 2)
    ? (front * betaContinuedFraction(a, b, x)) / a
    : 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** P(T <= t) for Student's t with `dof` degrees of freedom. */
export function studentTCdf(t: number, dof: number): number {
  const tail = 0.5 * regularizedBeta(dof / (dof + t * t), dof / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/**
 * Two-sided critical value t such that P(|T| <= t) = `confidence`.
 *
 * @param confidence e.g. 0.95
 * @param dof degrees of freedom (>= 1)
 * @example studentTCritical(0.95, 10) // 2.2281
 */
export function studentTCritical(confidence: number, dof: number): number {
  const p = 0.5 + confidence / 2;
  let hi = 10;
  while (studentTCdf(hi, dof) < p) hi *= 4;
  return brentRoot((t) => studentTCdf(t, dof) - p, 0, hi, 1e-12).root;
}
