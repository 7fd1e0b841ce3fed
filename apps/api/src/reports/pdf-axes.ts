/**
 * Axis ticks for printed plots: round numbers (1, 2 or 5 times a power of ten) on linear axes and
 * whole decades on log axes, the way plots in print are labelled (common practice, no source).
 */

/** The round step (1, 2 or 5 × 10^k) that divides `span` into about `target` intervals. */
export function niceStep(span: number, target: number): number {
  if (!(span > 0) || !(target > 0)) throw new RangeError('niceStep: span and target must be > 0');
  const raw = span / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / power;
  const nice = fraction <= 1.5 ? 1 : fraction <= 3.5 ? 2 : fraction <= 7.5 ? 5 : 10;
  return nice * power;
}

/** Round-number ticks covering [min, max]: the axis is widened to the outer ticks. */
export function niceTicks(min: number, max: number, target = 5): number[] {
  const lo = Math.min(min, max);
  let hi = Math.max(min, max);
  if (hi === lo) hi = lo + 1;
  const step = niceStep(hi - lo, target);
  const first = Math.floor(lo / step) * step;
  const ticks: number[] = [];
  for (let t = first; t <= hi + step * 1e-9; t += step) ticks.push(Number(t.toPrecision(12)));
  if (ticks[ticks.length - 1]! < hi)
    ticks.push(Number((ticks[ticks.length - 1]! + step).toPrecision(12)));
  return ticks;
}

/** A decade's label: plain digits from 0.001 to 10,000, otherwise a power of ten. */
export function decadeLabel(exponent: number): { base: string; exponent: string | null } {
  if (exponent >= -3 && exponent <= 4) {
    return {
      base: exponent < 0 ? (10 ** exponent).toFixed(-exponent) : String(10 ** exponent),
      exponent: null,
    };
  }
  return { base: '10', exponent: exponent < 0 ? `−${-exponent}` : String(exponent) };
}

/** Whole decades covering [minValue, maxValue] (both > 0), at most `max` labels apart evenly. */
export function decadeTicks(minValue: number, maxValue: number, max = 8): number[] {
  if (!(minValue > 0) || !(maxValue > 0)) throw new RangeError('decadeTicks: values must be > 0');
  let lo = Math.floor(Math.log10(Math.min(minValue, maxValue)));
  let hi = Math.ceil(Math.log10(Math.max(minValue, maxValue)));
  if (hi === lo) {
    lo -= 1;
    hi += 1;
  }
  const every = Math.max(1, Math.ceil((hi - lo) / max));
  // the axis ends on a labelled decade the same step on, never on a decade crowding the last
  hi = lo + every * Math.ceil((hi - lo) / every);
  const ticks: number[] = [];
  for (let k = lo; k <= hi; k += every) ticks.push(k);
  return ticks;
}

/**
 * Round ticks for a log x axis (1, 2 and 5 times powers of ten) from the last at or below `min`
 * to the first at or above `max`; only the powers of ten when those would be more than `max`.
 */
export function logRoundTicks(min: number, max: number, most = 7): number[] {
  if (!(min > 0) || !(max >= min)) throw new RangeError('logRoundTicks: need 0 < min <= max');
  const candidates: number[] = [];
  for (let k = Math.floor(Math.log10(min)) - 1; k <= Math.ceil(Math.log10(max)); k++) {
    for (const m of [1, 2, 5]) candidates.push(Number((m * 10 ** k).toPrecision(6)));
  }
  const lo = candidates.filter((c) => c <= min).pop()!;
  const hi = candidates.find((c) => c >= max)!;
  const ticks = candidates.filter((c) => c >= lo && c <= hi);
  if (ticks.length <= most) return ticks;
  const decades = ticks.filter((c) => /^1(e|$|0*$)|^0\.0*1$/.test(String(c)));
  return [...new Set([lo, ...decades, hi])];
}

/** A tick's label with as many decimals as its step needs (0.5 steps: "10.5", not "10.500"). */
export function tickLabel(value: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  return value.toFixed(Math.min(decimals, 12)).replace(/^-(0\.?0*)$/, '$1');
}

const PREFIXES: Record<number, string> = {
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  3: 'k',
  6: 'M',
  9: 'G',
};

/**
 * The SI prefix that keeps an axis's labels between 0.01 and 1000 (engineering steps of 10³):
 * µΩ·cm for metal films, MΩ·cm for semi-insulating wafers. Factor 1 and no prefix otherwise.
 */
export function axisPrefix(maxAbs: number): { factor: number; prefix: string } {
  if (!(maxAbs > 0) || (maxAbs >= 0.01 && maxAbs < 1000)) return { factor: 1, prefix: '' };
  const exponent = Math.max(-9, Math.min(9, 3 * Math.floor(Math.log10(maxAbs) / 3)));
  return { factor: 10 ** exponent, prefix: PREFIXES[exponent] ?? '' };
}
