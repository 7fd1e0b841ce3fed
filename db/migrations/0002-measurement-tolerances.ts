import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Tolerances the uncertainty budget of a 23 °C value reads (JCGM 100:2008): each is the
 * half-width of a rectangular distribution. Null means not stated.
 * - lots.thickness_tolerance_cm: the supplier's +/- thickness tolerance, cm.
 * - stations.probe_spacing_tolerance_cm: the probe head's +/- spacing tolerance, cm.
 * - stations.temperature_tolerance_k: the thermometer's +/- tolerance, K (when null, the
 *   sensor's class tolerance is assumed).
 */
const double = { type: DataTypes.DOUBLE, allowNull: true };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('lots', 'thickness_tolerance_cm', double);
  await qi.addColumn('stations', 'probe_spacing_tolerance_cm', double);
  await qi.addColumn('stations', 'temperature_tolerance_k', double);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('stations', 'temperature_tolerance_k');
  await qi.removeColumn('stations', 'probe_spacing_tolerance_cm');
  await qi.removeColumn('lots', 'thickness_tolerance_cm');
}
