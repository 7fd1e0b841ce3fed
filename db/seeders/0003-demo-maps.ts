import type { QueryInterface } from 'sequelize';
import { importSweep } from '../../apps/api/src/sweeps/sweep.service';
import { User } from '../../apps/api/src/users/user.model';
import { demoMap } from '../../seed-data/demo-maps';

/** A demo wafer map imported the way an upload is, so the map views have something to show. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const sequelize = qi.sequelize;
  const engineer = await User.findOne({ where: { email: 'engineer@rhotrace.example' } });
  if (!engineer) throw new Error('demo seed: run 0001-demo-lab first');
  const map = demoMap();
  const [[wafer]] = (await sequelize.query(
    'SELECT w.id FROM wafers w JOIN lots l ON l.id = w.lot_id WHERE l.code = ? AND w.number = ?',
    { replacements: [map.lotCode, map.waferNumber] },
  )) as [Array<{ id: number }>, unknown];
  const [[station]] = (await sequelize.query('SELECT id FROM stations WHERE name = ?', {
    replacements: [map.station],
  })) as [Array<{ id: number }>, unknown];
  if (!wafer || !station) throw new Error(`demo seed: no wafer or station for ${map.fileName}`);
  await importSweep(
    {
      waferId: wafer.id,
      file: map.file,
      originalName: map.fileName,
      method: 'four-point',
      stationId: station.id,
      geometry: {
        thicknessCm: map.thicknessCm,
        diameterCm: map.diameterCm,
        spacingCm: map.spacingCm,
      },
      map: { sitePattern: map.sitePattern, edgeExclusionMm: map.edgeExclusionMm },
    },
    {
      id: engineer.id,
      email: engineer.email,
      name: engineer.name,
      role: engineer.role,
      requestId: 'demo-seed',
    },
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  const [rows] = (await qi.sequelize.query(
    "SELECT id, storage_key FROM sweeps WHERE original_name = 'B014-03_map_ring25_296-333K.csv'",
  )) as [Array<{ id: number; storage_key: string }>, unknown];
  for (const r of rows) {
    await qi.bulkDelete('sweep_points', { sweep_id: r.id });
    await qi.bulkDelete('sweeps', { id: r.id });
    await qi.bulkDelete('raw_files', { storage_key: r.storage_key });
  }
}
