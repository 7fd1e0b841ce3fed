/**
 * A measurement plan from resolved facts (sample, station, limits): the physics library's
 * planner functions and model, composed. No database here.
 */
import type { DopingInput, PlannerResponse, PlanStepDto, RegimeName } from '@rhotrace/api-types';
import {
  denseAround,
  METAL_MODEL_RANGE_K,
  metalBlochGruneisen,
  modelCurve,
  modelCurveWarnings,
  PLAN_DEFAULTS,
  planCurrentRanges,
  planTemperatureSteps,
  regimeBoundaries,
  sweepDurationS,
  type Doping,
  type MetalId,
  type SemiconductorId,
} from '@rhotrace/physics';
import { badRequest } from '../errors';
import { modelVersion } from '../analysis/model-version';
import { isSemiconductor, semiconductorParameterSet } from '../analysis/model.service';
import { withPhysics } from '../analysis/physics-errors';
import { planCautions, planWarnings } from './plan-cautions';
import type { PlannerInput } from './planner.schemas';

/** The sample and station a plan is computed for, already looked up and checked. */
export interface PlanFacts {
  material: string;
  /** Null for a metal film. */
  doping: DopingInput | null;
  dopingSource: string;
  thicknessCm: number;
  diameterCm: number | null;
  station: { id: number; name: string; probeSpacingCm: number; minK: number; maxK: number };
}

interface ModelAlongSteps {
  resistivityOhmCm: number[];
  regimes: (RegimeName | null)[];
  boundaries: PlannerResponse['regimeBoundaries'];
  warnings: string[];
  parameterSet: string;
}

function semiconductorModel(
  material: SemiconductorId,
  doping: Doping,
  stepsK: number[],
  prefix: string,
) {
  return withPhysics(`${prefix}.doping`, () => {
    const points = modelCurve(material, doping, stepsK);
    return {
      resistivityOhmCm: points.map((p) => p.resistivityOhmCm),
      regimes: points.map((p) => p.regime),
      warnings: modelCurveWarnings(material, doping, stepsK),
      parameterSet: semiconductorParameterSet(material),
    };
  });
}

function metalModel(material: string, stepsK: number[], prefix: string): ModelAlongSteps {
  const [lo, hi] = METAL_MODEL_RANGE_K;
  const outside = stepsK.find((t) => t < lo || t > hi);
  if (outside !== undefined) {
    const field = `${prefix}.${outside < lo ? 'minK' : 'maxK'}`;
    const problem = `must lie within the ${material} model's range, ${lo}–${hi} K`;
    throw badRequest(`${field} ${problem}`, [{ field, problem }]);
  }
  return {
    resistivityOhmCm: stepsK.map((t) => metalBlochGruneisen(material as MetalId, t)),
    regimes: stepsK.map(() => null),
    boundaries: null,
    warnings: [],
    parameterSet: `metal-${material}-bg`,
  };
}

/** The temperatures, with extra steps around the regime boundaries when asked. */
function temperatures(input: PlannerInput, boundaries: PlannerResponse['regimeBoundaries']) {
  const steps = planTemperatureSteps(input);
  if (!input.denseAroundTransitions || !boundaries) return steps;
  return denseAround(steps, [boundaries.freezeOutBelowK, boundaries.intrinsicAboveK]);
}

/**
 * The plan: steps (evenly in T or 1/T, optionally denser around the computed freeze-out and
 * intrinsic boundaries), the model's rho(T) and regime at each, rho / t as sheet resistance, the
 * probe currents held over as few ranges as keep every voltage readable, the duration, and the
 * cautions and warnings.
 */
export function computePlan(
  input: PlannerInput,
  facts: PlanFacts,
  prefix = 'body',
): PlannerResponse {
  const material = facts.material;
  const doping = facts.doping as Doping | null;
  const semiconductor = doping !== null && isSemiconductor(material) ? material : null;
  const boundaries =
    semiconductor && doping
      ? withPhysics(`${prefix}.doping`, () => regimeBoundaries(semiconductor, doping))
      : null;
  const stepsK = temperatures(input, boundaries);
  const model: ModelAlongSteps =
    semiconductor && doping
      ? { ...semiconductorModel(semiconductor, doping, stepsK, prefix), boundaries }
      : metalModel(material, stepsK, prefix);
  const badIndex = model.resistivityOhmCm.findIndex((r) => !(r > 0) || !Number.isFinite(r));
  if (badIndex >= 0) {
    const problem = `the model gives no finite resistivity at ${stepsK[badIndex]!.toFixed(2)} K`;
    throw badRequest(`${prefix}.minK: ${problem}`, [{ field: `${prefix}.minK`, problem }]);
  }
  const sheet = model.resistivityOhmCm.map((r) => r / facts.thicknessCm);
  const limits = {
    method: input.method,
    targetVoltageV: input.targetVoltageV,
    maxVoltageV: input.maxVoltageV,
    maxPowerW: input.maxPowerW,
    ...(input.minCurrentA !== undefined ? { minCurrentA: input.minCurrentA } : {}),
    ...(input.maxCurrentA !== undefined ? { maxCurrentA: input.maxCurrentA } : {}),
    ...(input.method === 'four-point'
      ? {
          spacingCm: facts.station.probeSpacingCm,
          thicknessCm: facts.thicknessCm,
          ...(facts.diameterCm !== null ? { diameterCm: facts.diameterCm } : {}),
        }
      : {}),
  };
  const currents = withPhysics(`${prefix}.diameterCm`, () => planCurrentRanges(sheet, limits));
  const steps: PlanStepDto[] = stepsK.map((temperatureK, i) => ({
    temperatureK,
    expectedResistivityOhmCm: model.resistivityOhmCm[i]!,
    expectedSheetResistanceOhmSq: sheet[i]!,
    regime: model.regimes[i] ?? null,
    ...currents.steps[i]!,
  }));
  const dwellS = input.dwellS ?? PLAN_DEFAULTS.dwellS;
  const rampKPerMin = input.rampKPerMin ?? PLAN_DEFAULTS.rampKPerMin;
  const readableVoltageV: [number, number] = [input.maxVoltageV / 1000, input.maxVoltageV];
  return {
    steps,
    regimeBoundaries: model.boundaries,
    currentRanges: currents.ranges.map((r) => ({
      fromK: stepsK[r.fromIndex]!,
      toK: stepsK[r.toIndex]!,
      stepCount: r.toIndex - r.fromIndex + 1,
      currentA: r.currentA,
      limitedBy: r.limitedBy,
    })),
    estimatedDurationS: sweepDurationS(stepsK, { dwellS, rampKPerMin }),
    cautions: planCautions(facts.material, stepsK),
    warnings: [
      ...planWarnings(steps, { readableVoltageV, maxPowerW: input.maxPowerW }),
      ...model.warnings,
    ],
    basis: {
      material: facts.material,
      doping: facts.doping,
      dopingSource: facts.dopingSource,
      thicknessCm: facts.thicknessCm,
      diameterCm: facts.diameterCm,
      method: input.method,
      probeSpacingCm: input.method === 'four-point' ? facts.station.probeSpacingCm : null,
      stationId: facts.station.id,
      stationName: facts.station.name,
      stationRangeK: [facts.station.minK, facts.station.maxK],
      readableVoltageV,
      maxPowerW: input.maxPowerW,
      dwellS,
      rampKPerMin,
      modelVersion: modelVersion(model.parameterSet),
    },
  };
}
