import type { FitDto } from '@rhotrace/api-types';
import { parameterValueText } from '../../shared/format';
import { PARAMETER_WORDS, wordsFor } from './analysis-labels';
import type { ShownFit } from './fit-queue';

/**
 * The parameter a kind of fit is for: the activation energy of a window, the temperature
 * coefficient of a metal film (not its resistivity at the reference), the Debye temperature of
 * Bloch–Grüneisen. A full-model fit's is the first parameter it was asked to free.
 */
const MAIN_PARAMETER: Readonly<Record<string, string>> = {
  arrhenius: 'activationEnergyEv',
  tcr: 'alphaPerK',
  'bloch-gruneisen': 'debyeK',
};

/**
 * The key of a fit's main result. Never a parameter held fixed: only fitted parameters carry a
 * standard error entry, so a kind not in the table falls back to the first of those.
 */
export function mainParameter(fit: ShownFit | FitDto): string | null {
  const fitted = Object.keys(fit.standardErrors);
  const named = MAIN_PARAMETER[fit.kind];
  if (named && named in fit.parameters) return named;
  const free = fit.inputs['free'];
  if (Array.isArray(free)) {
    const first = free.find((p): p is string => typeof p === 'string' && p in fit.parameters);
    if (first) return first;
  }
  return fitted.find((p) => p in fit.parameters) ?? null;
}

/**
 * The main result in words, with a second unit where the parameter has one:
 * "Temperature coefficient (1/K): 0.0039 ± 2.1 × 10⁻⁵ (3900 ± 21 ppm/K)".
 */
export function mainResult(fit: ShownFit | FitDto): string {
  const key = mainParameter(fit);
  const value = key === null ? undefined : fit.parameters[key];
  if (key === null || value === undefined) return '–';
  const se = fit.standardErrors[key];
  const missing = se === null || se === undefined ? ' (no standard error)' : '';
  return `${wordsFor(PARAMETER_WORDS, key)}: ${parameterValueText(key, value, se)}${missing}`;
}
