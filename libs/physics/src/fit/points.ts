/**
 * Checks of measured point lists shared by the fits.
 */
import { describeValue, requireArray } from '../validate';

/** @internal points[i] as a record, or a TypeError naming it. */
export function pointRecord(
  fn: string,
  list: readonly unknown[],
  i: number,
): Record<string, unknown> {
  const p = list[i] as Record<string, unknown> | null;
  if (typeof p !== 'object' || p === null) {
    throw new TypeError(`\`${fn}\` requires points[${i}] to be an object, got ${describeValue(p)}`);
  }
  return p;
}

/** @internal points[i][key] as a positive finite number, or an error naming it. */
export function pointNumber(
  fn: string,
  p: Record<string, unknown>,
  i: number,
  key: string,
): number {
  const v = p[key];
  if (typeof v !== 'number') {
    throw new TypeError(
      `\`${fn}\` requires points[${i}].${key} to be a number, got ${describeValue(v)}`,
    );
  }
  if (!(v > 0) || !Number.isFinite(v)) {
    throw new RangeError(
      `\`${fn}\` requires points[${i}].${key} to be a finite number above 0, got ${v}`,
    );
  }
  return v;
}

/**
 * @internal Checks an array of objects holding positive finite numbers under the given keys and
 * returns them as parallel typed arrays.
 */
export function readPoints(
  fn: string,
  points: unknown,
  keys: readonly string[],
  minCount: number,
): Float64Array[] {
  const list = requireArray(fn, 'points', points, minCount);
  const columns = keys.map(() => new Float64Array(list.length));
  for (let i = 0; i < list.length; i++) {
    const p = pointRecord(fn, list, i);
    for (let k = 0; k < keys.length; k++) columns[k]![i] = pointNumber(fn, p, i, keys[k]!);
  }
  return columns;
}
