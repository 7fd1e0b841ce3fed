import type { FitDto, FitKind, FitPreviewDto, FitRequest } from '@rhotrace/api-types';
import { modelVersion } from '../analysis/model-version';
import { User } from '../users/user.model';
import type { FitComputation } from './fit-kinds';
import type { Fit } from './fit.model';

/** A fit computed over a sweep's window, before anything is stored. */
export interface ComputedFit {
  inputs: Record<string, unknown>;
  window: { minK: number | null; maxK: number | null };
  computed: FitComputation;
  parameterSet: string;
}

/** Fit-result fields the fit kinds here do not report: each fit states none of them. */
const UNSTATED_FIT_FIELDS = {
  stepCount: null,
  excludedSequences: [],
  interpretation: null,
  curvature: null,
  warnings: [],
} satisfies Pick<
  FitDto,
  'stepCount' | 'excludedSequences' | 'interpretation' | 'curvature' | 'warnings'
>;

/** The answer of a fit as it would be saved: everything but who saved it and when. */
export function previewOf(sweepId: number, request: FitRequest, fit: ComputedFit): FitPreviewDto {
  const { computed, window } = fit;
  return {
    sweepId,
    kind: request.kind,
    inputs: fit.inputs,
    windowMinK: window.minK,
    windowMaxK: window.maxK,
    parameters: computed.parameters as FitDto['parameters'],
    standardErrors: computed.standardErrors as FitDto['standardErrors'],
    confidenceIntervals: computed.confidenceIntervals as FitDto['confidenceIntervals'],
    goodness: computed.goodness as FitDto['goodness'],
    residuals: computed.residuals,
    converged: computed.converged,
    reason: computed.reason,
    reading: computed.reading,
    modelVersion: modelVersion(fit.parameterSet),
    ...UNSTATED_FIT_FIELDS,
  };
}

/** Shapes a stored fit for the API. */
export async function toFitDto(fit: Fit, names?: Map<number, string>): Promise<FitDto> {
  const name = names?.get(fit.createdById) ?? (await User.findByPk(fit.createdById))?.name ?? null;
  return {
    id: fit.id,
    sweepId: fit.sweepId,
    kind: fit.kind as FitKind,
    inputs: fit.inputs as Record<string, unknown>,
    windowMinK: fit.windowMinK,
    windowMaxK: fit.windowMaxK,
    parameters: fit.parameters as FitDto['parameters'],
    standardErrors: fit.standardErrors as FitDto['standardErrors'],
    confidenceIntervals: fit.confidenceIntervals as FitDto['confidenceIntervals'],
    goodness: fit.goodness as FitDto['goodness'],
    residuals: fit.residuals as FitDto['residuals'],
    converged: fit.converged,
    reason: fit.reason,
    reading: fit.reading,
    modelVersion: fit.modelVersion,
    createdBy: { id: fit.createdById, name },
    createdAt: fit.createdAt.toISOString(),
    ...UNSTATED_FIT_FIELDS,
  };
}
