/**
 * The Hall quantities of a fit's readings: the points of a Hall sweep that carry the quantity
 * and, for the carrier-density fit, the carrier type the fit assumes.
 */
import type { PointQuantities } from '@rhotrace/api-types';
import type { AnalysisPoint } from '../../analysis/sweep-data.service';
import { unprocessable } from '../../errors';

/** Readings with one Hall quantity, in the window's order. */
export interface HallSeries {
  /** The readings used (their residuals pair with these). */
  points: AnalysisPoint[];
  values: Array<{ temperatureK: number; value: number }>;
  /** Readings of the window left out because their carrier type is the other one. */
  otherType: number;
}

/**
 * The window's readings that carry `key` (of `type` when given). A sweep without Hall
 * quantities is a 422: the fit cannot run on it.
 */
export function hallSeries(
  points: readonly AnalysisPoint[],
  key: 'carrierDensityCm3' | 'hallMobilityCm2PerVs',
  what: string,
  type?: 'n' | 'p',
): HallSeries {
  const out: HallSeries = { points: [], values: [], otherType: 0 };
  let withQuantity = 0;
  for (const p of points) {
    const q: PointQuantities | undefined = p.quantities;
    const value = q?.[key];
    if (typeof value !== 'number' || !(value > 0)) continue;
    withQuantity += 1;
    if (type && q?.carrierType !== type) {
      out.otherType += 1;
      continue;
    }
    out.points.push(p);
    out.values.push({ temperatureK: p.temperatureK, value });
  }
  if (withQuantity === 0) {
    throw unprocessable(
      `A ${what} fit needs a Hall sweep: no reading in the window carries a Hall ${key}`,
    );
  }
  return out;
}

/** The warning for readings of the other carrier type left out, if any. */
export function otherTypeWarning(series: HallSeries, type: 'n' | 'p'): string[] {
  if (series.otherType === 0) return [];
  return [
    `${series.otherType} reading(s) in the window read ${type === 'n' ? 'p' : 'n'}-type ` +
      `(mixed conduction) and were left out; the fit assumes ${type}-type throughout.`,
  ];
}
