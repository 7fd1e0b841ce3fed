import { superscript } from '../format';

/** Ticks of a log axis: positions and their labels. */
export interface LogTicks {
  tickvals: number[];
  ticktext: string[];
}

/** Decades above which only powers of ten are labelled (1-2-5 labels would crowd). */
const MAX_DECADES_FOR_STEPS = 3;

/** 10^k as "10⁻³" (k an integer). */
export function powerOfTen(k: number): string {
  return `10${superscript(k)}`;
}

/** m x 10^k as a whole value ("0.5", "20", "2000") or, far from 1, "2×10⁻⁶". */
function stepLabel(mantissa: number, k: number): string {
  if (k >= -3 && k <= 4) {
    // toFixed with -k decimals keeps 0.005 from reading 0.0049999.
    return (mantissa * 10 ** k).toFixed(Math.max(0, -k));
  }
  return mantissa === 1 ? powerOfTen(k) : `${mantissa}×${powerOfTen(k)}`;
}

/**
 * Ticks of a log axis over [min, max] (positive values): at 1, 2 and 5 times each power of ten,
 * labelled with their whole values (0.5, 1, 2, 5, 10), when the range spans at most three
 * decades; beyond that, at powers of ten only, all labelled 10ⁿ (every other or third power
 * when there are many). Plotly's own minor labels read "2, 5" for 0.2 and 0.5 alike.
 */
export function logTicks(min: number, max: number): LogTicks | null {
  if (!(min > 0) || !(max >= min) || !Number.isFinite(max)) return null;
  const lo = Math.floor(Math.log10(min) + 1e-9);
  const hi = Math.ceil(Math.log10(max) - 1e-9);
  const decades = Math.max(1, hi - lo);
  const tickvals: number[] = [];
  const ticktext: string[] = [];
  if (decades <= MAX_DECADES_FOR_STEPS) {
    for (let k = lo; k <= hi; k++) {
      for (const m of [1, 2, 5]) {
        const v = m * 10 ** k;
        if (v < min / 1.0001 || v > max * 1.0001) continue;
        tickvals.push(v);
        ticktext.push(stepLabel(m, k));
      }
    }
    // A narrow range may hold a single step (or none): label its ends instead.
    if (tickvals.length >= 2) return { tickvals, ticktext };
  }
  const stride = Math.max(1, Math.ceil(decades / 8));
  for (let k = lo; k <= hi; k++) {
    if ((k - lo) % stride !== 0) continue;
    tickvals.push(10 ** k);
    ticktext.push(powerOfTen(k));
  }
  return { tickvals, ticktext };
}
