/**
 * The temperature window of the Hall fits.
 */
import { PhysicsInputError } from '../errors';
import { requirePositive } from '../validate';

/**
 * @internal Indices of the temperatures inside [options.minK, options.maxK] (inclusive; either
 * bound may be absent). Refuses reversed bounds.
 */
export function temperatureWindow(
  fn: string,
  options: Record<string, unknown>,
  temperaturesK: ArrayLike<number>,
): number[] {
  const min =
    options['minK'] === undefined ? 0 : requirePositive(fn, 'options.minK', options['minK']);
  const max =
    options['maxK'] === undefined
      ? Number.POSITIVE_INFINITY
      : requirePositive(fn, 'options.maxK', options['maxK']);
  if (!(min < max)) {
    throw new PhysicsInputError(fn, 'options.maxK', `requires options.maxK above options.minK`);
  }
  const out: number[] = [];
  for (let i = 0; i < temperaturesK.length; i++) {
    const t = temperaturesK[i]!;
    if (t >= min && t <= max) out.push(i);
  }
  return out;
}
