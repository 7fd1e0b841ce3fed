import type { DopingInput, MaterialsResponse, ModelCurveResponse } from '@rhotrace/api-types';
import { METAL_FILMS, alsoShownIn } from '@rhotrace/api-types';
import {
  METAL_BLOCH_GRUNEISEN,
  METAL_LINEAR_RANGE_K,
  METAL_MODEL_RANGE_K,
  METALS,
  PHYSICS_DEFAULTS,
  SEMICONDUCTORS,
  listMaterials,
  metalBlochGruneisen,
  metalResistivity,
  modelCurve,
  modelCurveWarnings,
  regimeBoundaries,
  type Doping,
  type MetalId,
  type SemiconductorId,
} from '@rhotrace/physics';
import { badRequest } from '../errors';
import { modelVersion } from './model-version';
import { withPhysics } from './physics-errors';

/** Model-curve request after validation. */
export interface CurveQuery {
  material: string;
  doping?: DopingInput;
  mobilityScale?: number;
  fromK: number;
  toK: number;
  steps: number;
}

/** `steps` temperatures evenly spaced from fromK to toK, both ends included. */
export function temperatureGrid(fromK: number, toK: number, steps: number): number[] {
  const grid: number[] = [];
  for (let i = 0; i < steps; i += 1) grid.push(fromK + ((toK - fromK) * i) / (steps - 1));
  grid[steps - 1] = toK;
  return grid;
}

/** Whether a material id is a modelled semiconductor. */
export function isSemiconductor(material: string): material is SemiconductorId {
  return (SEMICONDUCTORS as readonly string[]).includes(material);
}

/** Whether a material id is a metal film with reference data. */
export function isMetal(material: string): boolean {
  return (METAL_FILMS as readonly string[]).includes(material);
}

/** Short name of the parameter sets a semiconductor model uses (for `modelVersion`). */
export function semiconductorParameterSet(material: SemiconductorId): string {
  return `${material}:${PHYSICS_DEFAULTS.densityOfStatesSet[material]}`;
}

/**
 * The model curve: `modelCurve` and `regimeBoundaries` of the physics library for a
 * semiconductor, the metal reference curve for a metal film.
 */
export function curveFor(q: CurveQuery): ModelCurveResponse {
  const temperatures = temperatureGrid(q.fromK, q.toK, q.steps);
  if (isSemiconductor(q.material)) {
    if (!q.doping) {
      throw badRequest('doping is required for a semiconductor', [
        { field: 'body.doping', problem: 'is required for a semiconductor' },
      ]);
    }
    const material = q.material;
    const doping = q.doping as Doping;
    const options = { mobilityScale: q.mobilityScale ?? 1 };
    const points = withPhysics('body.doping', () =>
      modelCurve(material, doping, temperatures, options),
    );
    const boundaries = withPhysics('body.doping', () => regimeBoundaries(material, doping));
    const warnings = withPhysics('body.doping', () =>
      modelCurveWarnings(material, doping, temperatures),
    );
    return {
      kind: 'semiconductor',
      material,
      points,
      boundaries,
      modelVersion: modelVersion(semiconductorParameterSet(material)),
      warnings,
    };
  }
  if (isMetal(q.material)) {
    const { points, reference, parameterSet, warnings } = withPhysics('body.material', () =>
      metalCurve(q.material as MetalId, temperatures),
    );
    return {
      kind: 'metal',
      material: q.material,
      points,
      boundaries: null,
      reference,
      modelVersion: modelVersion(parameterSet),
      warnings,
    };
  }
  throw badRequest(`Unknown material ${q.material}`, [
    { field: 'body.material', problem: 'is not a known material' },
  ]);
}

/** Every material with its parameter sets and sources: the physics library's own catalogue. */
export function materials(): MaterialsResponse {
  return {
    ...(listMaterials() as unknown as Omit<MaterialsResponse, 'modelVersion'>),
    modelVersion: modelVersion('tables'),
  };
}

const within = (t: number, [lo, hi]: readonly [number, number]) => t >= lo && t <= hi;

/**
 * The metal reference curve: the library's Bloch–Grüneisen constants of the bulk metal
 * (`metalBlochGruneisen`, derived from the cited rho and alpha at 20 °C and the Debye
 * temperature) over 20–1000 K, and the linear reference (`metalResistivity`) over 200–600 K
 * only; null outside each range.
 */
function metalCurve(material: MetalId, temperaturesK: readonly number[]) {
  const constants = METAL_BLOCH_GRUNEISEN[material];
  const reference = METALS[material];
  const warnings: string[] = [];
  const [lo, hi] = METAL_MODEL_RANGE_K;
  if (temperaturesK.some((t) => !within(t, METAL_MODEL_RANGE_K))) {
    warnings.push(`The ${reference.name} model curve covers ${lo}–${hi} K only.`);
  }
  if (!constants.matchesAlpha) {
    warnings.push(
      `Bloch–Grüneisen cannot follow the tabulated temperature coefficient of ` +
        `${reference.name} (${reference.alphaPerK} 1/K, ` +
        `${alsoShownIn('alphaPerK', reference.alphaPerK)!.value} ppm/K, at 20 °C, raised by s–d or magnetic ` +
        `scattering): the curve matches rho at 20 °C and rises at ` +
        `${constants.alphaAt20CPerK.toFixed(5)} 1/K ` +
        `(${Number(alsoShownIn('alphaPerK', constants.alphaAt20CPerK)!.value.toPrecision(4))} ppm/K) there.`,
    );
  }
  return {
    points: temperaturesK.map((t) => ({
      temperatureK: t,
      resistivityOhmCm: within(t, METAL_MODEL_RANGE_K) ? metalBlochGruneisen(material, t) : null,
      linearReferenceOhmCm: within(t, METAL_LINEAR_RANGE_K) ? metalResistivity(material, t) : null,
    })),
    reference: {
      ...reference,
      model: 'bloch-gruneisen',
      validRangeK: [lo, hi],
      blochGruneisen: constants,
      linearValidRangeK: [...METAL_LINEAR_RANGE_K],
    },
    parameterSet: `metal-${material}-bg`,
    warnings,
  };
}
