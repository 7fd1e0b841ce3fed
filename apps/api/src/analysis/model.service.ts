import type { DopingInput, MaterialsResponse, ModelCurveResponse } from '@rhotrace/api-types';
import { METAL_FILMS } from '@rhotrace/api-types';
import {
  METALS,
  PHYSICS_DEFAULTS,
  SEMICONDUCTORS,
  listMaterials,
  metalResistivity,
  modelCurve,
  regimeBoundaries,
  type Doping,
  type MetalId,
  type SemiconductorId,
} from '@rhotrace/physics';
import { badRequest } from '../errors';
import { modelVersion } from './model-version';
import { withPhysics } from './physics-errors';

/** Range of the library's linear metal reference (`metalResistivity`), K. */
export const METAL_LINEAR_RANGE_K: readonly [number, number] = [100, 1000];

/** Model-curve request after validation. */
export interface CurveQuery {
  material: string;
  doping?: DopingInput;
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
    const points = withPhysics('body.doping', () => modelCurve(material, doping, temperatures));
    const boundaries = withPhysics('body.doping', () => regimeBoundaries(material, doping));
    return {
      kind: 'semiconductor',
      material,
      points,
      boundaries,
      modelVersion: modelVersion(semiconductorParameterSet(material)),
    };
  }
  if (isMetal(q.material)) {
    const { points, reference, parameterSet } = withPhysics('body.material', () =>
      metalCurve(q.material as MetalId, temperatures),
    );
    return {
      kind: 'metal',
      material: q.material,
      points,
      boundaries: null,
      reference,
      modelVersion: modelVersion(parameterSet),
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

/**
 * The metal reference curve: `metalResistivity` (linear, from the library's reference rho and
 * alpha at 20 °C) inside its 100–1000 K range, null outside it.
 */
function metalCurve(material: MetalId, temperaturesK: readonly number[]) {
  const [lo, hi] = METAL_LINEAR_RANGE_K;
  return {
    points: temperaturesK.map((t) => ({
      temperatureK: t,
      resistivityOhmCm: t >= lo && t <= hi ? metalResistivity(material, t) : null,
    })),
    reference: { ...METALS[material], model: 'linear', validRangeK: [lo, hi] },
    parameterSet: `metal-${material}`,
  };
}
