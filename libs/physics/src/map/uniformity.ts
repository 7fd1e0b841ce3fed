/**
 * Uniformity statistics of a wafer map: the figures the trade reports for resistivity and
 * sheet-resistance maps.
 */
import { PhysicsInputError } from '../errors';
import { requireArray, requireFiniteNumber, requireObject } from '../validate';

/** One site's value and position (mm from the wafer centre). */
export interface MapSiteValue {
  xMm: number;
  yMm: number;
  value: number;
}

/** Result of `mapUniformity`. */
export interface MapUniformity {
  count: number;
  mean: number;
  /** Sample standard deviation (n - 1); null for one site. */
  stdDev: number | null;
  /** stdDev / mean * 100; null for one site. */
  stdDevPercent: number | null;
  min: number;
  max: number;
  /** (max - min) / (max + min) * 100. */
  rangePercent: number;
  /**
   * Least-squares slope of value against radius, in per cent of the mean per mm; null when all
   * sites lie at one radius.
   */
  radialSlopePercentPerMm: number | null;
}

/**
 * Uniformity of a map over the sites given (the caller leaves out excluded sites).
 *
 * Formula: mean = sum v / n; s = sqrt(sum (v - mean)^2 / (n - 1)); stdDevPercent = 100 s / mean;
 * rangePercent = 100 (max - min) / (max + min); with r = sqrt(x^2 + y^2), the radial slope is
 * the ordinary least-squares slope b of v = a + b r, reported as 100 b / mean (% per mm).
 * Source: uniformity as the sample standard deviation in per cent of the mean and the range as
 * (max - min) / (max + min), as sheet-resistance maps of silicon are reported (SEMI MF81,
 * SEMI MF84); the radial slope is the product's own summary of a centre-to-edge trend.
 *
 * @param sites at least one, values positive and finite (ohm cm or ohm per square)
 * @example mapUniformity([{ xMm: 0, yMm: 0, value: 10 }, { xMm: 50, yMm: 0, value: 12 }])
 *   // { count: 2, mean: 11, stdDev: 1.4142, stdDevPercent: 12.856, min: 10, max: 12,
 *   //   rangePercent: 9.0909, radialSlopePercentPerMm: 0.36364 }
 */
export function mapUniformity(sites: readonly MapSiteValue[]): MapUniformity {
  const fn = 'mapUniformity';
  const list = requireArray(fn, 'sites', sites, 1);
  const values: number[] = [];
  const radii: number[] = [];
  list.forEach((item, i) => {
    const o = requireObject(fn, `sites[${i}]`, item);
    const x = requireFiniteNumber(fn, `sites[${i}].xMm`, o['xMm']);
    const y = requireFiniteNumber(fn, `sites[${i}].yMm`, o['yMm']);
    const v = requireFiniteNumber(fn, `sites[${i}].value`, o['value']);
    if (!(v > 0)) {
      throw new PhysicsInputError(
        fn,
        `sites[${i}].value`,
        `requires sites[${i}].value above 0, got ${v}`,
      );
    }
    values.push(v);
    radii.push(Math.hypot(x, y));
  });
  const n = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / n;
  const min = Math.min(...values);
  const max = Math.max(...values);
  let stdDev: number | null = null;
  if (n > 1) {
    const ss = values.reduce((a, v) => a + (v - mean) ** 2, 0);
    stdDev = Math.sqrt(ss / (n - 1));
  }
  const rMean = radii.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxy = 0;
  radii.forEach((r, i) => {
    sxx += (r - rMean) ** 2;
    sxy += (r - rMean) * (values[i]! - mean);
  });
  // A spread of radii below a micrometre squared is no spread: the slope is undefined.
  const slope = sxx > 1e-6 ? sxy / sxx : null;
  return {
    count: n,
    mean,
    stdDev,
    stdDevPercent: stdDev === null ? null : (100 * stdDev) / mean,
    min,
    max,
    rangePercent: (100 * (max - min)) / (max + min),
    radialSlopePercentPerMm: slope === null ? null : (100 * slope) / mean,
  };
}
