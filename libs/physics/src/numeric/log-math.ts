/**
 * Log-domain helpers: they keep the charge-neutrality solver free of overflow at 1 K, where
 * Boltzmann factors reach exp(±10^4).
 */

/** ln(1 + e^x), accurate for all finite x. */
export function softplus(x: number): number {
  return x > 0 ? x + Math.log1p(Math.exp(-x)) : Math.log1p(Math.exp(x));
}

/** ln(e^a + e^b); either argument may be -Infinity (an absent term). */
export function logAddExp(a: number, b: number): number {
  if (a === Number.NEGATIVE_INFINITY) return b;
  if (b === Number.NEGATIVE_INFINITY) return a;
  return a > b ? a + Math.log1p(Math.exp(b - a)) : b + Math.log1p(Math.exp(a - b));
}

/**
 * ln(e^a + e^b) as `logAddExp` computes it (the same bits), with the shares e^a / (e^a + e^b) and
 * e^b / (e^a + e^b) written to `out`: all three from the one exponential e^-|a - b|. Either
 * argument may be -Infinity (its share is then 0); not both.
 */
export function logAddExpWithShares(
  a: number,
  b: number,
  out: { first: number; second: number },
): number {
  if (b === Number.NEGATIVE_INFINITY) {
    out.first = 1;
    out.second = 0;
    return a;
  }
  if (a === Number.NEGATIVE_INFINITY) {
    out.first = 0;
    out.second = 1;
    return b;
  }
  if (a > b) {
    const r = Math.exp(b - a);
    out.first = 1 / (1 + r);
    out.second = r * out.first;
    return a + Math.log1p(r);
  }
  const r = Math.exp(a - b);
  out.second = 1 / (1 + r);
  out.first = r * out.second;
  return b + Math.log1p(r);
}

/** 1 / (1 + e^x) without overflow. */
export function logisticComplement(x: number): number {
  return x > 0 ? Math.exp(-x) / (1 + Math.exp(-x)) : 1 / (1 + Math.exp(x));
}

/**
 * softplus(x) = ln(1 + e^x), with 1 / (1 + e^-x) written to `out.logistic`: both from the one
 * exponential e^-|x|, and equal to the bit to `softplus(x)` and `logisticComplement(-x)`.
 */
export function softplusWithLogistic(x: number, out: { logistic: number }): number {
  const e = Math.exp(-Math.abs(x));
  out.logistic = x < 0 ? e / (1 + e) : 1 / (1 + e);
  return x > 0 ? x + Math.log1p(e) : Math.log1p(e);
}
