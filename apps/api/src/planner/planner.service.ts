import type { DopingInput, PlannerResponse, SessionUser } from '@rhotrace/api-types';
import { siliconDopantFromResistivity } from '@rhotrace/physics';
import type { Transaction } from 'sequelize';
import { visibleWafer } from '../access/visibility.service';
import { f723Dopant } from '../analysis/analysis.service';
import { isMetal } from '../analysis/model.service';
import { HttpError, validationFailed } from '../errors';
import type { Lot } from '../lots/lot.model';
import { Station } from '../stations/station.model';
import type { Wafer } from '../wafers/wafer.model';
import { computePlan, type PlanFacts } from './plan-compute';
import type { PlannerInput } from './planner.schemas';

/** Where a plan is computed: inside a transaction, and under which field its errors name. */
export interface PlanOptions {
  transaction?: Transaction;
  /** Prefix of the fields named in errors: `body`, or `body.plan` inside an assignment. */
  prefix?: string;
}

const refuser = (prefix: string) => (name: string, problem: string) =>
  validationFailed(`${prefix}.${name} ${problem}`, [{ field: `${prefix}.${name}`, problem }]);

/**
 * The doping a plan uses: the request's when given; otherwise, for boron- or phosphorus-doped
 * silicon, the density that ASTM F723 gives for the middle of the lot's resistivity spec (the
 * mean of its minimum and maximum, or the one that is set). Metal films have none.
 */
export function lotDoping(
  material: string,
  given: DopingInput | undefined,
  lot: Lot | null,
  prefix = 'body',
): { doping: DopingInput | null; source: string } {
  const refuse = refuser(prefix);
  if (isMetal(material)) return { doping: null, source: 'none: a metal film' };
  if (given) return { doping: given, source: 'given with the plan' };
  if (!lot) throw refuse('doping', 'is required for a semiconductor');
  const what = `is required: lot ${lot.code}`;
  if (lot.material !== 'Si') {
    throw refuse('doping', `${what} is ${lot.material}, and ASTM F723 covers silicon only`);
  }
  const dopant = f723Dopant(lot.dopant);
  if (!dopant) {
    throw refuse('doping', `${what} has dopant ${lot.dopant ?? '(not set)'}, not B or P`);
  }
  const bounds = [lot.specMinOhmCm, lot.specMaxOhmCm].filter((v): v is number => v !== null);
  if (!bounds.length) throw refuse('doping', `${what} has no resistivity spec`);
  const nominalOhmCm = bounds.reduce((a, b) => a + b, 0) / bounds.length;
  let density: number;
  try {
    density = siliconDopantFromResistivity(dopant, nominalOhmCm);
  } catch (error) {
    if (error instanceof RangeError) throw refuse('doping', `${what}: ${error.message}`);
    throw error;
  }
  const doping =
    dopant === 'boron'
      ? { donorDensity: 0, acceptorDensity: density, acceptor: 'B' }
      : { donorDensity: density, acceptorDensity: 0, donor: 'P' };
  return {
    doping,
    source:
      `lot ${lot.code}: ${dopant} at ${nominalOhmCm} ohm cm (the middle of its spec) through ` +
      'ASTM F723 (uncompensated)',
  };
}

async function sampleOf(
  user: SessionUser,
  waferId: number,
  options: PlanOptions,
): Promise<{ wafer: Wafer; lot: Lot }> {
  try {
    return await visibleWafer(user, waferId, options.transaction);
  } catch (error) {
    if (error instanceof HttpError && error.code === 'not_found') {
      throw refuser(options.prefix ?? 'body')('waferId', 'is not a wafer you can see');
    }
    throw error;
  }
}

/** The station, sample and doping a plan needs; each missing fact is a 400 naming its field. */
export async function planFacts(
  user: SessionUser,
  input: PlannerInput,
  options: PlanOptions = {},
): Promise<PlanFacts> {
  const refuse = refuser(options.prefix ?? 'body');
  const station = await Station.findByPk(input.stationId, { transaction: options.transaction });
  if (!station) throw refuse('stationId', 'is not a probe station');
  const range = `${station.name}'s range (${station.minTemperatureK}–${station.maxTemperatureK} K)`;
  if (input.minK < station.minTemperatureK) throw refuse('minK', `is below ${range}`);
  if (input.maxK > station.maxTemperatureK) throw refuse('maxK', `is above ${range}`);
  const sample = input.waferId === undefined ? null : await sampleOf(user, input.waferId, options);
  const material = sample?.lot.material ?? input.material!;
  const thicknessCm =
    input.thicknessCm ?? sample?.wafer.thicknessCm ?? sample?.lot.thicknessCm ?? null;
  if (thicknessCm === null) {
    throw refuse(
      'thicknessCm',
      sample ? `is required: wafer ${sample.wafer.number} and its lot have none` : 'is required',
    );
  }
  const { doping, source } = lotDoping(material, input.doping, sample?.lot ?? null, options.prefix);
  return {
    material,
    doping,
    dopingSource: source,
    thicknessCm,
    diameterCm: input.diameterCm ?? sample?.lot.diameterCm ?? null,
    station: {
      id: station.id,
      name: station.name,
      probeSpacingCm: station.probeSpacingCm,
      minK: station.minTemperatureK,
      maxK: station.maxTemperatureK,
    },
  };
}

/** `POST /api/planner`: the plan for the request's sample on the request's station. */
export async function planMeasurement(
  user: SessionUser,
  input: PlannerInput,
  options: PlanOptions = {},
): Promise<PlannerResponse> {
  return computePlan(input, await planFacts(user, input, options), options.prefix);
}
