import type { FitDto, FitGoodness } from '@rhotrace/api-types';
import type { FitResult } from '@rhotrace/physics';
import type { AnalysisPoint } from '../analysis/sweep-data.service';

/** What every fit kind computes before it is stored: the results part of `FitDto`. */
export type FitComputation = Pick<
  FitDto,
  | 'parameters'
  | 'standardErrors'
  | 'confidenceIntervals'
  | 'goodness'
  | 'residuals'
  | 'converged'
  | 'reason'
  | 'reading'
  | 'stepCount'
  | 'interpretation'
  | 'curvature'
  | 'warnings'
>;

const rms = (values: readonly number[]) =>
  values.length ? Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length) : 0;

/**
 * The stored shape of a physics `FitResult`: standard errors and intervals of the fitted
 * parameters, residuals ln(observed / model) paired with the readings' temperatures, goodness
 * with the degrees of freedom, iterations, t value and correlation matrix. `reading`,
 * `interpretation` and `curvature` are the kind's to add.
 */
export function computationOf<P extends string>(
  r: FitResult<P>,
  points: readonly AnalysisPoint[],
  extra: { goodness?: Partial<FitGoodness>; reading: string | null },
): FitComputation {
  return {
    parameters: { ...r.parameters },
    standardErrors: Object.fromEntries(r.fitted.map((n) => [n, r.standardErrors[n] ?? null])),
    confidenceIntervals: Object.fromEntries(
      r.fitted.map((n) => [n, r.confidenceIntervals95[n] ?? null]),
    ),
    goodness: {
      rSquared: r.rSquared,
      count: r.count,
      residualRms: rms(r.residuals),
      residualUnit: 'ln',
      degreesOfFreedom: r.degreesOfFreedom,
      iterations: r.iterations,
      tCritical: r.tCritical,
      correlation: r.correlation ? { parameters: [...r.fitted], matrix: r.correlation } : null,
      ...extra.goodness,
    },
    residuals: points.map((p, i) => ({ temperatureK: p.temperatureK, residual: r.residuals[i]! })),
    converged: r.converged,
    reason: r.reason,
    reading: extra.reading,
    stepCount: r.stepCount,
    interpretation: null,
    curvature: null,
    warnings: [...r.warnings],
  };
}
