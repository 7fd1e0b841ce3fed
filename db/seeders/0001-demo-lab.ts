import bcrypt from 'bcryptjs';
import type { QueryInterface } from 'sequelize';
import {
  DEMO_ASSIGNMENTS,
  DEMO_LOTS,
  DEMO_PASSWORD,
  DEMO_STATIONS,
  DEMO_USERS,
} from '../../seed-data/demo-lab';

/**
 * The invented demo lab: people (one account per role and a student), probe stations, lots,
 * wafers and assignments. Everything here is fictional (see seed-data/demo-lab.ts).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const now = new Date();
  const stamps = { created_at: now, updated_at: now };
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await qi.bulkInsert(
    'users',
    DEMO_USERS.map((u) => ({
      email: u.email,
      name: u.name,
      role: u.role,
      password_hash: hash,
      active: true,
      token_version: 0,
      ...stamps,
    })),
  );
  const [userRows] = (await qi.sequelize.query('SELECT id, email FROM users')) as [
    Array<{ id: number; email: string }>,
    unknown,
  ];
  const userId = (email: string) => {
    const row = userRows.find((u) => u.email === email);
    if (!row) throw new Error(`demo seed: no user ${email}`);
    return row.id;
  };
  await qi.bulkInsert(
    'stations',
    DEMO_STATIONS.map((s) => ({
      name: s.name,
      probe_spacing_cm: s.probeSpacingCm,
      tip_radius_cm: s.tipRadiusCm,
      thermometer: s.thermometer,
      rtd_r0_ohm: s.rtdR0Ohm,
      min_temperature_k: s.minTemperatureK,
      max_temperature_k: s.maxTemperatureK,
      calibrated_on: s.calibratedOn,
      probe_spacing_tolerance_cm: s.probeSpacingToleranceCm,
      temperature_tolerance_k: s.temperatureToleranceK,
      notes: s.notes,
      ...stamps,
    })),
  );
  for (const lot of DEMO_LOTS) {
    await qi.bulkInsert('lots', [
      {
        code: lot.code,
        material: lot.material,
        dopant: lot.dopant,
        dopant_type: lot.dopantType,
        orientation: lot.orientation,
        diameter_cm: lot.diameterCm,
        thickness_cm: lot.thicknessCm,
        thickness_tolerance_cm: lot.thicknessToleranceCm ?? null,
        supplier: lot.supplier,
        received_on: lot.receivedOn,
        spec_min_ohm_cm: lot.specMinOhmCm,
        spec_max_ohm_cm: lot.specMaxOhmCm,
        notes: lot.notes,
        created_by_id: userId('engineer@rhotrace.example'),
        ...stamps,
      },
    ]);
    const [[lotRow]] = (await qi.sequelize.query('SELECT id FROM lots WHERE code = ?', {
      replacements: [lot.code],
    })) as [Array<{ id: number }>, unknown];
    await qi.bulkInsert(
      'wafers',
      lot.wafers.map((w) => ({
        lot_id: lotRow!.id,
        number: w.number,
        thickness_cm: w.thicknessCm,
        state: w.state,
        notes: w.notes,
        ...stamps,
      })),
    );
  }
  const [waferRows] = (await qi.sequelize.query(
    'SELECT w.id, w.number, l.code FROM wafers w JOIN lots l ON l.id = w.lot_id',
  )) as [Array<{ id: number; number: string; code: string }>, unknown];
  const waferId = (code: string, number: string) => {
    const row = waferRows.find((w) => w.code === code && w.number === number);
    if (!row) throw new Error(`demo seed: no wafer ${code}/${number}`);
    return row.id;
  };
  const today = new Date();
  const day = (offset: number) =>
    new Date(today.getTime() + offset * 86_400_000).toISOString().slice(0, 10);
  await qi.bulkInsert(
    'assignments',
    DEMO_ASSIGNMENTS.map((a) => ({
      wafer_id: waferId(a.lotCode, a.waferNumber),
      assignee_id: userId(a.assignee),
      assigned_by_id: userId('manager@rhotrace.example'),
      task: a.task,
      due_date: day(a.dueInDays),
      state: a.state,
      notes: a.notes,
      ...stamps,
    })),
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of ['assignments', 'wafers', 'lots', 'stations', 'users']) {
    await qi.bulkDelete(table, {});
  }
}
