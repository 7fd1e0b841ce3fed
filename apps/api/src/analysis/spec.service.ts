/**
 * A sweep's 23 °C value with its uncertainty budget, and a wafer's newest sweep that gives one.
 */
import type { AnalysisStep, SweepGeometry, ValueUncertainty } from '@rhotrace/api-types';
import type { Lot } from '../lots/lot.model';
import { Station } from '../stations/station.model';
import { Sweep } from '../sweeps/sweep.model';
import type { Wafer } from '../wafers/wafer.model';
import { lotModel } from './lot-model';
import { uncertaintyBudget } from './spec-uncertainty';
import { sweepSteps } from './sweep-data.service';
import {
  SPEC_TEMPERATURE_K,
  valueAt23C,
  type ModelResistivity,
  type ValueAt23C,
} from './value-at-23c';

/** A 23 °C value and its uncertainty. */
export interface Assessment {
  value: ValueAt23C;
  uncertainty: ValueUncertainty;
}

const NO_UNCERTAINTY: ValueUncertainty = {
  uncertaintyOhmCm: null,
  coverageFactor: null,
  uncertaintyBudget: [],
};

/** The 23 °C value of a sweep's steps and its budget from the sweep's station and lot. */
export async function assessSweep(
  sweep: Sweep,
  wafer: Wafer,
  lot: Lot,
  steps: readonly AnalysisStep[],
): Promise<Assessment> {
  const nearest = [...steps].sort(
    (a, b) =>
      Math.abs(a.temperatureK - SPEC_TEMPERATURE_K) - Math.abs(b.temperatureK - SPEC_TEMPERATURE_K),
  )[0];
  // Built only when a single step needs it: anchoring the model is a root search.
  let built: ModelResistivity | null | undefined;
  const model: ModelResistivity = (t) => {
    if (built === undefined) {
      built = nearest ? lotModel(lot, nearest.temperatureK, nearest.resistivityOhmCm) : null;
    }
    return built ? built(t) : null;
  };
  const value = valueAt23C(steps, model);
  if (value.resistivityOhmCm === null) return { value, uncertainty: NO_UNCERTAINTY };
  // A station deleted since still describes the sweeps it measured.
  const station = sweep.stationId
    ? await Station.findByPk(sweep.stationId, { paranoid: false })
    : null;
  const uncertainty = uncertaintyBudget(value, {
    method: sweep.method,
    geometry: (sweep.geometry as SweepGeometry | null) ?? null,
    station: station && {
      name: station.name,
      thermometer: station.thermometer,
      probeSpacingToleranceCm: station.probeSpacingToleranceCm ?? null,
      temperatureToleranceK: station.temperatureToleranceK ?? null,
    },
    thicknessCm: wafer.thicknessCm ?? lot.thicknessCm,
    thicknessToleranceCm: lot.thicknessToleranceCm,
  });
  return { value, uncertainty };
}

/**
 * The sweep that gives a wafer its 23 °C value: the one an engineer chose (`countedSweepId`), else
 * the newest that reaches 23 °C; or the reason none does.
 */
export async function waferAssessment(
  wafer: Wafer,
  lot: Lot,
): Promise<{ sweepId: number | null; sweepCount: number } & Assessment> {
  const sweeps = await Sweep.findAll({
    where: { waferId: wafer.id },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  // A sweep an engineer chose counts, whether or not it reaches 23 °C (its reason then says so).
  const chosen = sweeps.find((s) => s.id === wafer.countedSweepId);
  if (chosen) {
    const steps = await sweepSteps(chosen);
    return {
      sweepId: chosen.id,
      sweepCount: sweeps.length,
      ...(await assessSweep(chosen, wafer, lot, steps)),
    };
  }
  let firstMiss: ValueAt23C | null = null;
  for (const sweep of sweeps) {
    const steps = await sweepSteps(sweep);
    const assessed = await assessSweep(sweep, wafer, lot, steps);
    if (assessed.value.resistivityOhmCm !== null) {
      return { sweepId: sweep.id, sweepCount: sweeps.length, ...assessed };
    }
    firstMiss ??= assessed.value;
  }
  return {
    sweepId: null,
    sweepCount: sweeps.length,
    uncertainty: NO_UNCERTAINTY,
    value: firstMiss ?? { ...valueAt23C([]), reason: 'The wafer has no sweep' },
  };
}
