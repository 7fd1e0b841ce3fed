/**
 * Thermal lag between a sample and its thermometer, read from a sweep that ramps up and back
 * down over the same temperatures.
 */
import { PhysicsInputError } from '../errors';
import { requireArray, requireFiniteNumber } from '../validate';

/** One leg's curve: temperatures (sensor), K, and ln rho at each, in any order. */
export interface LegCurve {
  temperaturesK: number[];
  lnRho: number[];
}

/** The lag and its standard error, K, and the number of up-leg readings compared. */
export interface ThermalLag {
  lagK: number;
  standardErrorK: number;
  count: number;
}

function sortedCurve(fn: string, name: string, c: LegCurve): Array<[number, number]> {
  const t = requireArray(fn, `${name}.temperaturesK`, c.temperaturesK, 2);
  const y = requireArray(fn, `${name}.lnRho`, c.lnRho, 2);
  if (t.length !== y.length) {
    throw new PhysicsInputError(fn, name, `requires ${name} temperatures and lnRho of one length`);
  }
  return t
    .map(
      (v, i) =>
        [requireFiniteNumber(fn, `${name}.temperaturesK`, v), Number(y[i])] as [number, number],
    )
    .sort((a, b) => a[0] - b[0]);
}

/** Linear interpolation of y at x on a sorted curve, and its local slope; null outside. */
function at(curve: Array<[number, number]>, x: number): [number, number] | null {
  if (x < curve[0]![0] || x > curve[curve.length - 1]![0]) return null;
  let k = 0;
  while (k < curve.length - 2 && curve[k + 1]![0] < x) k++;
  const [x0, y0] = curve[k]!;
  const [x1, y1] = curve[k + 1]!;
  const slope = x1 > x0 ? (y1 - y0) / (x1 - x0) : 0;
  return [y0 + slope * (x - x0), slope];
}

/**
 * The sensor-to-sample lag L from an up leg and a down leg. A sample trailing its thermometer
 * by L reads rho(T - L) on the way up and rho(T + L) on the way down (T the sensor reading), so
 * y_up(T) = y_down(T - D) with D = 2 L: the up curve sits D to the right of the down curve at
 * equal resistivity. D is found by Gauss-Newton least squares over the up readings inside the
 * overlap (the down curve interpolated linearly, its slope as the Jacobian), and its standard
 * error from the residual scatter, SE(D) = s / sqrt(sum slope^2); L = D / 2, positive when the
 * sample trails the sensor. Assumes a lag the same on both legs and no hysteresis of the sample
 * itself. Source: common practice for ramped measurements, no single source; least squares as
 * in Bevington & Robinson, Data Reduction and Error Analysis (2003), ch. 8.
 *
 * @param up readings of the leg that warms
 * @param down readings of the leg that cools
 * @returns the lag, or null when fewer than 3 up readings lie inside the overlap or the curve is
 *   flat there (no resistivity contrast to read a shift from)
 * @example thermalLag(up, down).lagK // about 1.0 for a synthetic 1 K lag
 */
export function thermalLag(up: LegCurve, down: LegCurve): ThermalLag | null {
  const fn = 'thermalLag';
  const u = sortedCurve(fn, 'up', up);
  const d = sortedCurve(fn, 'down', down);
  let shift = 0;
  let rows: Array<[number, number]> = [];
  for (let iteration = 0; iteration < 20; iteration++) {
    rows = [];
    for (const [t, y] of u) {
      const v = at(d, t - shift);
      if (v) rows.push([y - v[0], v[1]]);
    }
    const ss = rows.reduce((s, [, g]) => s + g * g, 0);
    if (rows.length < 3 || !(ss > 0)) return null;
    // r(D + dD) = r(D) + slope dD: the step minimises sum r^2
    const step = -rows.reduce((s, [r, g]) => s + r * g, 0) / ss;
    shift += step;
    if (Math.abs(step) < 1e-9) break;
  }
  const ss = rows.reduce((s, [, g]) => s + g * g, 0);
  const residual = rows.reduce((s, [r]) => s + r * r, 0) / Math.max(1, rows.length - 1);
  return {
    lagK: shift / 2,
    standardErrorK: Math.sqrt(residual / ss) / 2,
    count: rows.length,
  };
}
