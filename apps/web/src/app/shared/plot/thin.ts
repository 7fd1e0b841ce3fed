import { MAX_POINTS_PER_TRACE } from './decimate';

/**
 * Most markers a page asks a plot to draw; longer series are thinned for display (fits use every
 * point). The plot itself thins any longer trace (see `thinTrace`) and says so under it, so a page
 * may also pass every point.
 */
export const MAX_DISPLAY_POINTS = MAX_POINTS_PER_TRACE;

/**
 * Thins a series for display: the series is cut into MAX_DISPLAY_POINTS / 2 runs in order and
 * each run keeps its lowest and highest point, so peaks, knees and outliers stay visible.
 */
export function thinForDisplay<T>(
  items: readonly T[],
  value: (item: T) => number,
  max = MAX_DISPLAY_POINTS,
): T[] {
  if (items.length <= max) return [...items];
  const runs = Math.max(1, Math.floor(max / 2));
  const out: T[] = [];
  for (let r = 0; r < runs; r++) {
    const from = Math.floor((r * items.length) / runs);
    const to = Math.floor(((r + 1) * items.length) / runs);
    let lo = from;
    let hi = from;
    for (let i = from + 1; i < to; i++) {
      if (value(items[i]!) < value(items[lo]!)) lo = i;
      if (value(items[i]!) > value(items[hi]!)) hi = i;
    }
    if (lo === hi) out.push(items[lo]!);
    else out.push(items[Math.min(lo, hi)]!, items[Math.max(lo, hi)]!);
  }
  return out;
}

/**
 * The sentence under a plot whose series was thinned for display: how, and that the numbers
 * do not depend on it. Empty when nothing was left out.
 */
export function thinningNote(shown: number, total: number, what = 'steps'): string {
  if (shown >= total) return '';
  return (
    `The plot draws ${shown} of ${total} ${what}: the series is cut into runs in order and the ` +
    `lowest and highest of each run are drawn, so peaks, knees and outliers stay visible. ` +
    `Fits, values and exports use every one of the ${total}.`
  );
}
