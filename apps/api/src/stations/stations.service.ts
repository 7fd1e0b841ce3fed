import type {
  Page,
  StationDto,
  StationInput,
  StationSensor,
  Thermometer,
} from '@rhotrace/api-types';
import {
  calibrationTableTemperatureK,
  PhysicsInputError,
  type CalibrationPoint,
} from '@rhotrace/physics';
import { Op, UniqueConstraintError, type WhereOptions } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { conflict, notFound, validationFailed } from '../errors';
import { likePattern, orderFrom } from '../db/query';
import { calibrationState } from './calibration';
import { Station } from './station.model';
import { inTransaction } from '../db/connection';

/** The station's calibration under the lab's interval, as the DTO states it. */
function calibrationOf(calibratedOn: string | null) {
  const { dueOn, overdue } = calibrationState(calibratedOn);
  return { calibrationDueOn: dueOn, calibrationOverdue: overdue };
}

/** The API's view of a probe station. */
export function toStationDto(s: Station): StationDto {
  return {
    id: s.id,
    name: s.name,
    probeSpacingCm: s.probeSpacingCm,
    tipRadiusCm: s.tipRadiusCm,
    thermometer: s.thermometer,
    rtdR0Ohm: s.rtdR0Ohm,
    sensor: s.sensor ?? legacySensor(s),
    minTemperatureK: s.minTemperatureK,
    maxTemperatureK: s.maxTemperatureK,
    calibratedOn: s.calibratedOn,
    ...calibrationOf(s.calibratedOn),
    probeSpacingToleranceCm: s.probeSpacingToleranceCm ?? null,
    temperatureToleranceK: s.temperatureToleranceK ?? null,
    notes: s.notes,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
  };
}

/** The sensor the older fields describe (a thermocouple's type was never recorded). */
function legacySensor(s: Pick<StationInput, 'thermometer' | 'rtdR0Ohm'>): StationSensor | null {
  if (s.thermometer === 'platinum-rtd') return { kind: 'platinum-rtd', r0Ohm: s.rtdR0Ohm ?? 100 };
  if (s.thermometer === 'thermocouple') return { kind: 'thermocouple', type: null };
  return null;
}

/**
 * One truth for the thermometer: a `sensor` given sets the older `thermometer` and `rtdR0Ohm`
 * to match; older fields given without a sensor replace the sensor with what they describe.
 */
function withSensor<T extends Partial<StationInput>>(changes: T, before?: StationDto): T {
  if (changes.sensor) {
    const sensor = changes.sensor;
    if (changes.thermometer !== undefined && changes.thermometer !== sensor.kind) {
      throw validationFailed('The station fields do not agree', [
        { field: 'body.thermometer', problem: `must match sensor.kind (${sensor.kind})` },
      ]);
    }
    return {
      ...changes,
      thermometer: sensor.kind,
      rtdR0Ohm: sensor.kind === 'platinum-rtd' ? sensor.r0Ohm : null,
    };
  }
  if (changes.thermometer === undefined && changes.rtdR0Ohm === undefined) return changes;
  const merged = { ...before, ...changes } as Pick<StationInput, 'thermometer' | 'rtdR0Ohm'>;
  const keepTc = merged.thermometer === 'thermocouple' && before?.sensor?.kind === 'thermocouple';
  return { ...changes, sensor: keepTc ? before!.sensor : legacySensor(merged) };
}

/** Cross-field rules, checked on the merged record: range order, R0 for a platinum RTD. */
function assertConsistent(
  s: Pick<
    StationInput,
    'thermometer' | 'rtdR0Ohm' | 'minTemperatureK' | 'maxTemperatureK' | 'sensor'
  >,
) {
  const problems = [];
  if (s.minTemperatureK >= s.maxTemperatureK) {
    problems.push({
      field: 'body.minTemperatureK',
      problem: `must be below maxTemperatureK (${s.maxTemperatureK})`,
    });
  }
  if (s.thermometer === 'platinum-rtd' && s.rtdR0Ohm == null) {
    problems.push({
      field: 'body.rtdR0Ohm',
      problem: 'is required for a platinum RTD (its resistance at 0 °C)',
    });
  }
  if (s.thermometer === 'table' && s.sensor?.kind !== 'table') {
    problems.push({
      field: 'body.sensor',
      problem: 'a calibration-table thermometer needs its points: { kind: "table", points }',
    });
  }
  const table = s.sensor?.kind === 'table' ? s.sensor.points : null;
  const tableProblem = table ? calibrationTableProblem(table) : null;
  if (tableProblem) problems.push({ field: 'body.sensor.points', problem: tableProblem });
  if (s.thermometer === 'thermocouple' && s.rtdR0Ohm != null) {
    problems.push({
      field: 'body.rtdR0Ohm',
      problem: 'applies to a platinum RTD only; leave it null',
    });
  }
  if (problems.length) throw validationFailed('The station fields do not agree', problems);
}

/**
 * Why a calibration table cannot convert readings (the physics library's own check: distinct
 * readings, the temperature running one way with them), or null when it can.
 */
function calibrationTableProblem(points: CalibrationPoint[]): string | null {
  try {
    calibrationTableTemperatureK(points, points[0]!.reading);
    return null;
  } catch (error) {
    if (error instanceof PhysicsInputError && error.argument === 'table') return error.requirement;
    throw error;
  }
}

function duplicateName(error: unknown, name: string | undefined): never {
  if (error instanceof UniqueConstraintError) {
    throw conflict(`A station named "${name}" already exists`, { field: 'name' });
  }
  throw error;
}

export interface StationListOptions {
  page: number;
  pageSize: number;
  sort?: string;
  q?: string;
  thermometer?: Thermometer;
}

/** A page of stations (every role sees stations: they pick one when uploading). */
export async function listStations(options: StationListOptions): Promise<Page<StationDto>> {
  const where: WhereOptions<Station>[] = [];
  if (options.q) {
    const like = likePattern(options.q);
    where.push({ [Op.or]: [{ name: { [Op.like]: like } }, { notes: { [Op.like]: like } }] });
  }
  if (options.thermometer) where.push({ thermometer: options.thermometer });
  const { rows, count } = await Station.findAndCountAll({
    where: { [Op.and]: where },
    order: orderFrom(options.sort, 'name'),
    limit: options.pageSize,
    offset: (options.page - 1) * options.pageSize,
  });
  return {
    items: rows.map(toStationDto),
    total: count,
    page: options.page,
    pageSize: options.pageSize,
  };
}

/** One station or 404. */
export async function getStation(id: number): Promise<StationDto> {
  const station = await Station.findByPk(id);
  if (!station) throw notFound(`Station ${id}`);
  return toStationDto(station);
}

/** Registers a probe station, with its audit event. */
export async function createStation(given: StationInput, actor: Actor): Promise<StationDto> {
  const input = withSensor(given);
  assertConsistent(input);
  try {
    return await inTransaction(async (t) => {
      const station = await Station.create(input, { transaction: t });
      const dto = toStationDto(station);
      await auditChange(t, actor, 'create', 'station', station.id, { after: dto });
      return dto;
    });
  } catch (error) {
    return duplicateName(error, input.name);
  }
}

/** Changes a station; the merged record must still be consistent. */
export async function updateStation(
  id: number,
  changes: Partial<StationInput>,
  actor: Actor,
): Promise<StationDto> {
  try {
    return await inTransaction(async (t) => {
      const station = await Station.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!station) throw notFound(`Station ${id}`);
      const before = toStationDto(station);
      const update = withSensor(changes, before);
      assertConsistent({ ...before, ...update });
      await station.update(update, { transaction: t });
      const dto = toStationDto(station);
      await auditChange(t, actor, 'update', 'station', id, { before, after: dto });
      return dto;
    });
  } catch (error) {
    return duplicateName(error, changes.name);
  }
}

/** Retires a station (soft delete; sweeps keep pointing at it), with its audit event. */
export async function deleteStation(id: number, actor: Actor): Promise<void> {
  await inTransaction(async (t) => {
    const station = await Station.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!station) throw notFound(`Station ${id}`);
    const before = toStationDto(station);
    await station.destroy({ transaction: t });
    await auditChange(t, actor, 'delete', 'station', id, { before, after: null });
  });
}
