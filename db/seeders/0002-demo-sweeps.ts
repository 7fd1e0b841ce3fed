import type { QueryInterface } from 'sequelize';
import { createFit } from '../../apps/api/src/fits/fit.service';
import { importSweep } from '../../apps/api/src/sweeps/sweep.service';
import { User } from '../../apps/api/src/users/user.model';
import { demoSweeps } from '../../seed-data/demo-sweeps';

/**
 * Demo sweeps imported the way an upload is (parsed, converted, stored with its raw file and
 * audit event), and a few saved fits, so every screen has something to show.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const sequelize = qi.sequelize;
  const engineer = await User.findOne({ where: { email: 'engineer@rhotrace.example' } });
  const physicist = await User.findOne({ where: { email: 'physicist@rhotrace.example' } });
  if (!engineer || !physicist) throw new Error('demo seed: run 0001-demo-lab first');
  const asActor = (u: User) => ({
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    requestId: 'demo-seed',
  });
  const ids: Record<string, number> = {};
  for (const sweep of demoSweeps()) {
    const [[wafer]] = (await sequelize.query(
      'SELECT w.id FROM wafers w JOIN lots l ON l.id = w.lot_id WHERE l.code = ? AND w.number = ?',
      { replacements: [sweep.lotCode, sweep.waferNumber] },
    )) as [Array<{ id: number }>, unknown];
    const [[station]] = (await sequelize.query('SELECT id FROM stations WHERE name = ?', {
      replacements: [sweep.station],
    })) as [Array<{ id: number }>, unknown];
    if (!wafer || !station) throw new Error(`demo seed: no wafer or station for ${sweep.fileName}`);
    const created = await importSweep(
      {
        waferId: wafer.id,
        file: sweep.file,
        originalName: sweep.fileName,
        method: 'four-point',
        stationId: station.id,
        geometry: {
          thicknessCm: sweep.thicknessCm,
          diameterCm: sweep.diameterCm,
          spacingCm: sweep.spacingCm,
        },
      },
      asActor(engineer),
    );
    ids[`${sweep.lotCode}/${sweep.waferNumber}`] = created.id;
  }
  const actor = { id: physicist.id, requestId: 'demo-seed' };
  const user = asActor(physicist);
  const p021 = ids['LV-26-P021/W01'];
  if (p021) {
    await createFit(
      sequelize,
      user,
      p021,
      {
        kind: 'arrhenius',
        minK: 600,
        maxK: 700,
        quantity: 'resistivity',
        prefactorExponent: 0,
        regime: 'intrinsic',
      },
      actor,
    );
  }
  const w007 = ids['LV-26-W007/W01'];
  if (w007) await createFit(sequelize, user, w007, { kind: 'tcr', referenceK: 293.15 }, actor);
  const b014 = ids['LV-26-B014/W01'];
  if (b014)
    await createFit(
      sequelize,
      user,
      b014,
      {
        kind: 'arrhenius',
        minK: 25,
        maxK: 50,
        quantity: 'resistivity',
        prefactorExponent: 0,
        regime: 'freeze-out',
      },
      actor,
    );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.bulkDelete('fits', {});
  await qi.bulkDelete('sweep_points', {});
  await qi.bulkDelete('sweeps', {});
  await qi.bulkDelete('raw_files', {});
}
