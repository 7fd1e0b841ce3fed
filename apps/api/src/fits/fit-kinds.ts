import type { FitGoodness } from '@rhotrace/api-types';
import {
  PHYSICS_DEFAULTS,
  SEMICONDUCTORS,
  blochGruneisen,
  fitArrhenius,
  fitBlochGruneisen,
  fitLinearTcr,
  fitModel,
  interpretArrheniusSlope,
  resistivity,
  type Doping,
  type Regime,
  type SemiconductorId,
} from '@rhotrace/physics';
import { rSquared as rSquaredOf } from 'simple-statistics';
import type { AnalysisPoint } from '../analysis/sweep-data.service';

/** What every fit kind computes, before it is stored. */
export interface FitComputation {
  parameters: Record<string, number>;
  standardErrors: Record<string, number | null>;
  confidenceIntervals: Record<string, [number, number] | null>;
  goodness: FitGoodness;
  residuals: Array<{ temperatureK: number; residual: number }>;
  converged: boolean;
  reason: string | null;
  reading: string | null;
}

/** Parameters a full-model fit may free. */
export const MODEL_FREE_PARAMETERS = [
  'donorDensity',
  'acceptorDensity',
  'donorLevel',
  'acceptorLevel',
  'mobilityScale',
] as const;
export type ModelFreeParameter = (typeof MODEL_FREE_PARAMETERS)[number];

const rms = (values: readonly number[]) =>
  values.length ? Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length) : 0;

/**
 * Arrhenius fit through `fitArrhenius`; residuals are the library's (measured minus fitted, in
 * the log of the fitted quantity) and the reading is `interpretArrheniusSlope` for the regime.
 */
export function arrheniusFit(
  points: readonly AnalysisPoint[],
  input: {
    quantity: 'resistivity' | 'conductivity';
    prefactorExponent: number;
    material: string;
    regime: Regime | null;
    compensated: boolean;
  },
): FitComputation {
  const values = points.map((p) => ({
    temperatureK: p.temperatureK,
    value: input.quantity === 'conductivity' ? 1 / p.resistivityOhmCm : p.resistivityOhmCm,
  }));
  const r = fitArrhenius(values, {
    quantity: input.quantity,
    prefactorExponent: input.prefactorExponent,
  });
  const residuals = values.map((v, i) => ({
    temperatureK: v.temperatureK,
    residual: r.residuals[i]!,
  }));
  const midK = (points[0]!.temperatureK + points[points.length - 1]!.temperatureK) / 2;
  const material = (SEMICONDUCTORS as readonly string[]).includes(input.material)
    ? (input.material as SemiconductorId)
    : undefined;
  const reading = input.regime
    ? interpretArrheniusSlope({
        activationEnergyEv: r.activationEnergyEv,
        regime: input.regime,
        compensated: input.compensated,
        material,
        temperatureK: midK,
      })
    : null;
  return {
    parameters: {
      activationEnergyEv: r.activationEnergyEv,
      intercept: r.intercept,
      ...(reading?.impliedEv != null ? { impliedEv: reading.impliedEv } : {}),
    },
    standardErrors: { activationEnergyEv: r.standardErrorEv, intercept: r.interceptStandardError },
    confidenceIntervals: { activationEnergyEv: r.ci95Ev },
    goodness: {
      rSquared: r.rSquared,
      count: r.count,
      residualRms: rms(residuals.map((x) => x.residual)),
      residualUnit: 'ln',
      tCritical: r.tCritical,
    },
    residuals,
    converged: true,
    reason: null,
    reading: reading
      ? reading.text
      : 'No regime was given or suggested for this window, so the slope is not interpreted.',
  };
}

/**
 * Full-model Levenberg–Marquardt fit through `fitModel`. Residuals are ln(measured / model)
 * (the library's, sign turned to measured minus model like the other kinds).
 */
export function modelFit(
  points: readonly AnalysisPoint[],
  material: SemiconductorId,
  initial: Doping & { mobilityScale?: number },
  free: readonly ModelFreeParameter[],
): FitComputation {
  const { mobilityScale: startScale, ...doping } = initial;
  const r = fitModel([...points], material, doping, [...free], { mobilityScale: startScale ?? 1 });
  const p = r.parameters;
  const fitted: Doping = {
    donorDensity: p.donorDensity,
    acceptorDensity: p.acceptorDensity,
    donorLevel: p.donorLevel,
    acceptorLevel: p.acceptorLevel,
  };
  const lnModel = (t: number) =>
    Math.log(resistivity(material, fitted, t, { mobilityScale: p.mobilityScale }));
  return {
    parameters: { ...p },
    standardErrors: { ...r.standardErrors },
    confidenceIntervals: { ...r.confidenceIntervals95 },
    goodness: {
      rSquared: rSquaredOf(
        points.map((pt) => [pt.temperatureK, Math.log(pt.resistivityOhmCm)]),
        lnModel,
      ),
      count: points.length,
      residualRms: r.residualRms,
      residualUnit: 'ln',
      iterations: r.iterations,
      degreesOfFreedom: r.degreesOfFreedom,
    },
    residuals: points.map((pt, i) => ({
      temperatureK: pt.temperatureK,
      residual: -r.residuals[i]!,
    })),
    converged: r.converged,
    reason: r.reason,
    reading: r.converged
      ? `Fitted ${free.join(', ')} of the ${material} model to ${points.length} points in ` +
        `${r.iterations} iterations (RMS ${r.residualRms.toPrecision(3)} in ln rho).`
      : `The fit did not converge: ${r.reason}`,
  };
}

/** Linear temperature coefficient through `fitLinearTcr`, with its relative residuals. */
export function tcrFit(points: readonly AnalysisPoint[], referenceK: number): FitComputation {
  const r = fitLinearTcr([...points], referenceK);
  const residuals = points.map((pt, i) => ({
    temperatureK: pt.temperatureK,
    residual: r.relativeResiduals[i]!,
  }));
  return {
    parameters: { referenceResistivityOhmCm: r.referenceResistivityOhmCm, alphaPerK: r.alphaPerK },
    standardErrors: {
      referenceResistivityOhmCm: r.standardErrorReferenceOhmCm,
      alphaPerK: r.standardErrorAlpha,
    },
    confidenceIntervals: { alphaPerK: r.ci95AlphaPerK },
    goodness: {
      rSquared: r.rSquared,
      count: r.count,
      residualRms: rms(residuals.map((x) => x.residual)),
      residualUnit: 'relative',
      referenceK,
    },
    residuals,
    converged: true,
    reason: null,
    reading:
      `Resistivity ${r.referenceResistivityOhmCm.toPrecision(4)} ohm cm at ${referenceK} K, ` +
      `rising ${(r.alphaPerK * 100).toPrecision(3)} % per kelvin.`,
  };
}

/** Bloch–Grüneisen fit through `fitBlochGruneisen`; residuals ln(measured / model). */
export function blochGruneisenFit(points: readonly AnalysisPoint[]): FitComputation {
  const r = fitBlochGruneisen([...points]);
  const p = r.parameters;
  return {
    parameters: { ...p },
    standardErrors: { ...r.standardErrors },
    confidenceIntervals: { ...r.confidenceIntervals95 },
    goodness: {
      rSquared: rSquaredOf(
        points.map((pt) => [pt.temperatureK, pt.resistivityOhmCm]),
        (t) => blochGruneisen(t, p),
      ),
      count: points.length,
      residualRms: r.residualRms,
      residualUnit: 'ln',
      iterations: r.iterations,
    },
    residuals: points.map((pt, i) => ({
      temperatureK: pt.temperatureK,
      residual: -r.residuals[i]!,
    })),
    converged: r.converged,
    reason: r.reason,
    reading: r.converged
      ? `Residual resistivity ${p.residualOhmCm.toPrecision(3)} ohm cm, coupling ` +
        `${p.couplingOhmCm.toPrecision(3)} ohm cm, Debye temperature ${p.debyeK.toPrecision(3)} K.`
      : `The fit did not converge: ${r.reason}`,
  };
}

/** The TCR reference temperature the library defaults to, K. */
export const DEFAULT_TCR_REFERENCE_K = PHYSICS_DEFAULTS.tcrReferenceK;
