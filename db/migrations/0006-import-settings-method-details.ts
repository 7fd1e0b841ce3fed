import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * import_settings.method_details: the upload fields that belong to one method, saved with the
 * rest so the next file of the shape is preset with them too (JSON, null when none):
 * { hallFactor } for Hall sweeps (a number or a named scattering factor) and
 * { map: { sitePattern, edgeExclusionMm } } for wafer maps. Earlier rows keep null.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('import_settings', 'method_details', {
    type: DataTypes.TEXT('long'),
    allowNull: true,
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('import_settings', 'method_details');
}
