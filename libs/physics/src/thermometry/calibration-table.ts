/**
 * A sensor's own calibration table (cryogenic diodes, germanium, Cernox or other resistance
 * sensors): reading to temperature by monotone piecewise cubic Hermite interpolation.
 */
import { PhysicsInputError } from '../errors';
import { requireArray, requireFiniteNumber, requireObject, requirePositive } from '../validate';

/** How far beyond its ends a table may be read, as a fraction of its reading span. */
export const CALIBRATION_EXTRAPOLATION_FRACTION = 0.02;

/** One calibration point: a sensor reading (its own unit) and the temperature it stands for. */
export interface CalibrationPoint {
  reading: number;
  temperatureK: number;
}

const FN = 'calibrationTableTemperatureK';

/** The table sorted by reading, checked: at least two points, distinct readings, monotone. */
function checkedTable(table: unknown): CalibrationPoint[] {
  const rows = requireArray(FN, 'table', table, 2).map((row, i) => {
    const o = requireObject(FN, `table[${i}]`, row);
    return {
      reading: requireFiniteNumber(FN, `table[${i}].reading`, o['reading']),
      temperatureK: requirePositive(FN, `table[${i}].temperatureK`, o['temperatureK']),
    };
  });
  rows.sort((a, b) => a.reading - b.reading);
  let direction = 0;
  for (let i = 1; i < rows.length; i++) {
    const dr = rows[i]!.reading - rows[i - 1]!.reading;
    const dt = Math.sign(rows[i]!.temperatureK - rows[i - 1]!.temperatureK);
    if (dr === 0 || dt === 0 || (direction !== 0 && dt !== direction)) {
      throw new PhysicsInputError(
        FN,
        'table',
        `requires a table whose temperature rises or falls strictly with the reading; ` +
          `readings ${rows[i - 1]!.reading} and ${rows[i]!.reading} break it`,
      );
    }
    direction = dt;
  }
  return rows;
}

/**
 * The slope at an end: the three-point one-sided formula, limited so it keeps the end interval
 * monotone (C. Moler, Numerical Computing with MATLAB, 2004, section 3.4, as in pchip); the end
 * secant for a two-point table.
 */
function endSlope(h0: number, h1: number | undefined, d0: number, d1: number | undefined): number {
  if (h1 === undefined || d1 === undefined) return d0;
  const m = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
  if (Math.sign(m) !== Math.sign(d0)) return 0;
  if (Math.sign(d0) !== Math.sign(d1) && Math.abs(m) > Math.abs(3 * d0)) return 3 * d0;
  return m;
}

/**
 * Slopes dT/dreading at the table points: Fritsch–Butland weighted harmonic means inside (zero
 * where the neighbouring secants change sign, which a monotone table never has), the end
 * three-point slopes at the ends (`endSlope`). These slopes keep the interpolant monotone between points.
 */
function slopes(x: number[], y: number[]): number[] {
  const n = x.length;
  const h = x.slice(1).map((xi, i) => xi - x[i]!);
  const d = h.map((hi, i) => (y[i + 1]! - y[i]!) / hi);
  const m = new Array<number>(n);
  m[0] = endSlope(h[0]!, h[1], d[0]!, d[1]);
  m[n - 1] = endSlope(h[n - 2]!, h[n - 3], d[n - 2]!, d[n - 3]);
  for (let k = 1; k < n - 1; k++) {
    const d0 = d[k - 1]!;
    const d1 = d[k]!;
    if (d0 * d1 <= 0) {
      m[k] = 0;
      continue;
    }
    const w1 = 2 * h[k]! + h[k - 1]!;
    const w2 = h[k]! + 2 * h[k - 1]!;
    m[k] = (w1 + w2) / (w1 / d0 + w2 / d1);
  }
  return m;
}

/**
 * Temperature from a sensor reading through the sensor's calibration table.
 *
 * Method: monotone piecewise cubic Hermite interpolation of temperature against reading
 * (PCHIP: F. N. Fritsch and R. E. Carlson, SIAM J. Numer. Anal. 17, 238 (1980), with the interior
 * slopes of F. N. Fritsch and J. Butland, SIAM J. Sci. Stat. Comput. 5, 300 (1984)); it passes
 * through every point, never overshoots between them and reproduces a linear table exactly.
 * Beyond the ends it continues along the end slope, but only for
 * `CALIBRATION_EXTRAPOLATION_FRACTION` (2 %) of the table's reading span; further it refuses.
 * The table may be given in any order; temperature must rise or fall strictly with the reading
 * (a diode's voltage falls as it warms, a platinum resistance rises).
 *
 * @param table calibration points, reading in the sensor's own unit, temperature in K
 * @param reading the reading to convert, same unit as the table
 * @returns temperature, K
 * @example calibrationTableTemperatureK([{ reading: 1, temperatureK: 10 }, { reading: 2, temperatureK: 20 }], 1.5) // 15
 */
export function calibrationTableTemperatureK(
  table: Array<{ reading: number; temperatureK: number }>,
  reading: number,
): number {
  const rows = checkedTable(table);
  const r = requireFiniteNumber(FN, 'reading', reading);
  const x = rows.map((p) => p.reading);
  const y = rows.map((p) => p.temperatureK);
  const n = x.length;
  const allowance = (x[n - 1]! - x[0]!) * CALIBRATION_EXTRAPOLATION_FRACTION;
  if (r < x[0]! - allowance || r > x[n - 1]! + allowance) {
    throw new PhysicsInputError(
      FN,
      'reading',
      `requires a reading within the calibration table (${x[0]} to ${x[n - 1]}, ` +
        `read up to 2 % of its span beyond), got ${r}`,
    );
  }
  const m = slopes(x, y);
  let result: number;
  if (r <= x[0]!) result = y[0]! + m[0]! * (r - x[0]!);
  else if (r >= x[n - 1]!) result = y[n - 1]! + m[n - 1]! * (r - x[n - 1]!);
  else {
    let k = 0;
    while (r > x[k + 1]!) k++;
    const h = x[k + 1]! - x[k]!;
    const s = (r - x[k]!) / h;
    const s2 = s * s;
    const s3 = s2 * s;
    result =
      (2 * s3 - 3 * s2 + 1) * y[k]! +
      (s3 - 2 * s2 + s) * h * m[k]! +
      (-2 * s3 + 3 * s2) * y[k + 1]! +
      (s3 - s2) * h * m[k + 1]!;
  }
  if (!(result > 0)) {
    throw new PhysicsInputError(FN, 'reading', `gives no temperature above 0 K for ${r}`);
  }
  return result;
}
