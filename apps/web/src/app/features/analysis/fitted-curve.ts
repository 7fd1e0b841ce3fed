import {
  type SemiconductorId,
  SEMICONDUCTORS,
  PHYSICS_DEFAULTS,
  arrheniusValue,
  blochGruneisen,
  linearTcrResistivity,
  resistivity,
} from '@rhotrace/physics';
import { type TemperatureUnit, formatTemperatureRange } from '../../shared/temperature-unit';
import { FIT_TRACE_WORDS, wordsFor } from './analysis-labels';
import { type ShownFit, isSaved } from './fit-queue';

/** Temperatures at which a fitted curve is evaluated for drawing. */
const CURVE_POINTS = 120;

/** One point of a fitted curve. */
export interface FittedPoint {
  temperatureK: number;
  resistivityOhmCm: number;
}

/**
 * The resistivity a fit describes at `temperatureK`, from its stored parameters through the
 * physics library's own functions (the formula each fit fitted), or null where the fit has no
 * curve there (a parameter missing, a temperature the model refuses).
 */
export function fittedResistivity(fit: ShownFit, temperatureK: number): number | null {
  const p = fit.parameters;
  const num = (key: string) => (typeof p[key] === 'number' ? p[key] : Number.NaN);
  try {
    switch (fit.kind) {
      case 'arrhenius': {
        const quantity = fit.inputs['quantity'] === 'conductivity' ? 'conductivity' : 'resistivity';
        const m = fit.inputs['prefactorExponent'];
        const value = arrheniusValue(
          { activationEnergyEv: num('activationEnergyEv'), intercept: num('intercept') },
          { quantity, prefactorExponent: typeof m === 'number' ? m : undefined },
          temperatureK,
        );
        return quantity === 'conductivity' ? 1 / value : value;
      }
      case 'tcr': {
        const ref = fit.inputs['referenceK'];
        return linearTcrResistivity(
          {
            referenceResistivityOhmCm: num('referenceResistivityOhmCm'),
            alphaPerK: num('alphaPerK'),
          },
          typeof ref === 'number' ? ref : PHYSICS_DEFAULTS.tcrReferenceK,
          temperatureK,
        );
      }
      case 'bloch-gruneisen':
        return blochGruneisen(temperatureK, {
          residualOhmCm: num('residualOhmCm'),
          couplingOhmCm: num('couplingOhmCm'),
          debyeK: num('debyeK'),
        });
      case 'model': {
        const material = fit.inputs['material'];
        if (!isSemiconductor(material)) return null;
        return resistivity(
          material,
          {
            donorDensity: num('donorDensity'),
            acceptorDensity: num('acceptorDensity'),
            donorLevel: num('donorLevel'),
            acceptorLevel: num('acceptorLevel'),
          },
          temperatureK,
          { mobilityScale: num('mobilityScale') },
        );
      }
      default:
        return null;
    }
  } catch {
    // The physics functions refuse what they cannot evaluate; such a point is not drawn.
    return null;
  }
}

/** The temperatures a fit covers: its window, else the span of the readings it fitted. */
export function fittedSpanK(fit: ShownFit): { minK: number; maxK: number } | null {
  if (fit.windowMinK !== null && fit.windowMaxK !== null)
    return { minK: fit.windowMinK, maxK: fit.windowMaxK };
  if (fit.residuals.length === 0) return null;
  let minK = Infinity;
  let maxK = -Infinity;
  for (const r of fit.residuals) {
    minK = Math.min(minK, r.temperatureK);
    maxK = Math.max(maxK, r.temperatureK);
  }
  return minK < maxK ? { minK, maxK } : null;
}

/** The fitted curve over the fit's span, evenly spaced; empty when nothing can be drawn. */
export function fittedCurve(fit: ShownFit, points = CURVE_POINTS): FittedPoint[] {
  const span = fittedSpanK(fit);
  if (!span) return [];
  const out: FittedPoint[] = [];
  for (let i = 0; i < points; i++) {
    const t = span.minK + ((span.maxK - span.minK) * i) / (points - 1);
    const rho = fittedResistivity(fit, t);
    if (rho !== null && Number.isFinite(rho) && rho > 0)
      out.push({ temperatureK: t, resistivityOhmCm: rho });
  }
  return out;
}

/**
 * The legend name of a fit: its kind as a fit, its span in the page's unit and which fit it is,
 * e.g. "Arrhenius fit, 450.0–600.0 K (fit 12)" or "Linear TCR fit, 25.0–180.0 °C (preview)".
 */
export function fitTraceName(fit: ShownFit, unit: TemperatureUnit): string {
  const span = fittedSpanK(fit);
  const range = span ? `, ${formatTemperatureRange(span.minK, span.maxK, unit)}` : '';
  const which = isSaved(fit) ? `fit ${fit.id}` : 'preview';
  return `${wordsFor(FIT_TRACE_WORDS, fit.kind)}${range} (${which})`;
}

/**
 * The fit's residuals as ln(ρ measured / ρ fitted): the stored ones, sign turned for a fit of
 * conductivity (whose residuals are ln(σ measured / σ fitted)).
 */
export function residualsAsResistivity(
  fit: ShownFit,
): Array<{ temperatureK: number; residual: number }> {
  const flip = fit.kind === 'arrhenius' && fit.inputs['quantity'] === 'conductivity';
  return flip
    ? fit.residuals.map((r) => ({ temperatureK: r.temperatureK, residual: -r.residual }))
    : fit.residuals;
}

function isSemiconductor(material: unknown): material is SemiconductorId {
  return typeof material === 'string' && (SEMICONDUCTORS as readonly string[]).includes(material);
}

/** The fits a ρ(T) plot draws: those shown in the panels, then saved ones not among them. */
export function fitsToDraw(
  panels: ReadonlyArray<ShownFit | null>,
  compared: readonly ShownFit[],
): ShownFit[] {
  const shown = panels.filter((f): f is ShownFit => f !== null);
  const ids = new Set(shown.filter(isSaved).map((f) => f.id));
  return [...shown, ...compared.filter((f) => !isSaved(f) || !ids.has(f.id))];
}
