/**
 * Input checks for the public boundary of the library.
 *
 * Every public function checks its arguments once, here, and throws a `PhysicsTypeError` (a
 * `TypeError`: wrong kind of value) or a `PhysicsInputError` (a `RangeError`: right kind, unusable
 * value) that carries the function and argument names as fields; the message names them too,
 * e.g. "`bandGap` requires a temperature (temperatureK) between 1 K and 1500 K, got 0".
 * Internal code then trusts its inputs, which keeps the hot loops free of checks.
 */
import { BOUND_ALLOWANCE_K, MAX_TEMPERATURE_K, MIN_TEMPERATURE_K } from './constants';
import { PhysicsInputError, PhysicsTypeError } from './errors';

/** Formats a received value for an error message without throwing on odd inputs. */
export function describeValue(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number' || typeof value === 'boolean' || value === undefined) {
    return String(value);
  }
  if (value === null) return 'null';
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  return typeof value;
}

/**
 * Requires a finite number.
 * @throws PhysicsTypeError when `value` is not a number; PhysicsInputError when it is NaN or
 *   infinite.
 */
export function requireFiniteNumber(fn: string, name: string, value: unknown): number {
  if (typeof value !== 'number') {
    throw new PhysicsTypeError(
      fn,
      name,
      `requires ${name} to be a number, got ${describeValue(value)}`,
    );
  }
  if (!Number.isFinite(value)) {
    throw new PhysicsInputError(fn, name, `requires ${name} to be a finite number, got ${value}`);
  }
  return value;
}

/** Requires a finite number strictly above zero. */
export function requirePositive(fn: string, name: string, value: unknown): number {
  const v = requireFiniteNumber(fn, name, value);
  if (v <= 0) throw new PhysicsInputError(fn, name, `requires ${name} above 0, got ${v}`);
  return v;
}

/** Requires a finite number at or above zero. */
export function requireNonNegative(fn: string, name: string, value: unknown): number {
  const v = requireFiniteNumber(fn, name, value);
  if (v < 0) throw new PhysicsInputError(fn, name, `requires ${name} of at least 0, got ${v}`);
  return v;
}

/**
 * Requires a number in [min, max] (inclusive, with an absolute `allowance` for rounding); values
 * inside the allowance are clamped onto the bound.
 */
export function requireInRange(
  fn: string,
  name: string,
  value: unknown,
  min: number,
  max: number,
  options: { what?: string; unit?: string; allowance?: number } = {},
): number {
  const v = requireFiniteNumber(fn, name, value);
  const allowance = options.allowance ?? 0;
  const unit = options.unit ? ` ${options.unit}` : '';
  if (v < min - allowance || v > max + allowance) {
    const what = options.what ? `${options.what} (${name})` : name;
    throw new PhysicsInputError(
      fn,
      name,
      `requires ${what} between ${min}${unit} and ${max}${unit}, got ${v}`,
    );
  }
  return Math.min(max, Math.max(min, v));
}

/** Requires a temperature in the semiconductor range, 1 K to 1500 K inclusive. */
export function requireTemperatureK(fn: string, value: unknown, name = 'temperatureK'): number {
  return requireInRange(fn, name, value, MIN_TEMPERATURE_K, MAX_TEMPERATURE_K, {
    what: 'a temperature',
    unit: 'K',
    allowance: BOUND_ALLOWANCE_K,
  });
}

/** Requires one of a fixed set of string values. */
export function requireOneOf<T extends string>(
  fn: string,
  name: string,
  value: unknown,
  allowed: readonly T[],
): T {
  if (typeof value !== 'string') {
    throw new PhysicsTypeError(
      fn,
      name,
      `requires ${name} to be one of ${allowed.join(', ')}, got ${describeValue(value)}`,
    );
  }
  if (!(allowed as readonly string[]).includes(value)) {
    throw new PhysicsInputError(
      fn,
      name,
      `requires ${name} to be one of ${allowed.join(', ')}, got ${describeValue(value)}`,
    );
  }
  return value as T;
}

/** Requires a plain object (not null, not an array). */
export function requireObject(fn: string, name: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new PhysicsTypeError(
      fn,
      name,
      `requires ${name} to be an object, got ${describeValue(value)}`,
    );
  }
  return value as Record<string, unknown>;
}

/** Requires an array, optionally with a minimum length. */
export function requireArray(fn: string, name: string, value: unknown, minLength = 0): unknown[] {
  if (!Array.isArray(value)) {
    throw new PhysicsTypeError(
      fn,
      name,
      `requires ${name} to be an array, got ${describeValue(value)}`,
    );
  }
  if (value.length < minLength) {
    throw new PhysicsInputError(
      fn,
      name,
      `requires ${name} to hold at least ${minLength} entries, got ${value.length}`,
    );
  }
  return value;
}
