/**
 * Records the sweep specs need: a lot, a wafer, a station, an assignment; and the plain
 * four-point upload the fault specs send.
 */
import request from 'supertest';
import { Assignment } from '../assignments/assignment.model';
import { Lot } from '../lots/lot.model';
import { Station } from '../stations/station.model';
import type { TestContext } from '../testing/test-context';
import { Wafer } from '../wafers/wafer.model';

let serial = 0;

/** A lot and wafer with the given geometry (cm). */
export async function makeWafer(
  geometry: { thicknessCm?: number; diameterCm?: number; lotThicknessCm?: number } = {},
): Promise<Wafer> {
  serial += 1;
  const lot = await Lot.create({
    code: `DEMO-${process.pid}-${serial}`,
    material: 'Si',
    dopant: 'B',
    dopantType: 'p',
    orientation: '<100>',
    diameterCm: geometry.diameterCm ?? null,
    thicknessCm: geometry.lotThicknessCm ?? null,
    supplier: 'Example Wafers Ltd.',
    receivedOn: null,
    specMinOhmCm: null,
    specMaxOhmCm: null,
    notes: null,
    createdById: null,
  });
  return Wafer.create({
    lotId: lot.id,
    number: `W${serial}`,
    thicknessCm: geometry.thicknessCm ?? null,
    notes: null,
  });
}

/** A probe station. */
export async function makeStation(s: {
  probeSpacingCm: number;
  thermometer?: 'thermocouple' | 'platinum-rtd';
  rtdR0Ohm?: number | null;
  name?: string;
  minTemperatureK?: number;
  maxTemperatureK?: number;
  calibratedOn?: string | null;
}): Promise<Station> {
  serial += 1;
  return Station.create({
    name: s.name ?? `Example station ${serial}`,
    probeSpacingCm: s.probeSpacingCm,
    tipRadiusCm: null,
    thermometer: s.thermometer ?? 'thermocouple',
    rtdR0Ohm: s.rtdR0Ohm ?? null,
    minTemperatureK: s.minTemperatureK ?? 4,
    maxTemperatureK: s.maxTemperatureK ?? 800,
    calibratedOn: s.calibratedOn ?? null,
    notes: null,
  });
}

/** Assigns `waferId` to the context's technician. */
export async function assignToTechnician(ctx: TestContext, waferId: number): Promise<void> {
  await Assignment.create({
    waferId,
    assigneeId: ctx.users.technician.id,
    assignedById: ctx.users.manager.id,
    task: 'Measure rho(T) from 80 K to 500 K',
    dueDate: '2031-01-31',
    notes: null,
  });
}

/**
 * Uploads `file` to a wafer as the signed-in user `auth` gives (`ctx.auth(role)`): a four-point
 * sweep, probe spacing 1 mm.
 */
export function uploadFourPoint(
  ctx: TestContext,
  auth: Record<string, string>,
  waferId: number,
  file: Buffer,
) {
  return request(ctx.app)
    .post(`/api/wafers/${waferId}/sweeps`)
    .set(auth)
    .field('method', 'four-point')
    .field('spacingCm', '0.1')
    .attach('file', file, 'sweep.csv');
}
