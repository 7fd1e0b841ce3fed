import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Fits record what they were fitted on and how they read: the dwell steps fitted, the flagged
 * readings left out, the interpretation of the slope, the Arrhenius curvature check and the
 * warnings. JSON documents as LONGTEXT, as in the first schema. Older fits keep NULL.
 */
const json = { type: DataTypes.TEXT('long'), allowNull: true };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('fits', 'step_count', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('fits', 'excluded_sequences', json);
  await qi.addColumn('fits', 'interpretation', json);
  await qi.addColumn('fits', 'curvature', json);
  await qi.addColumn('fits', 'warnings', json);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const column of ['warnings', 'curvature', 'interpretation', 'excluded_sequences']) {
    await qi.removeColumn('fits', column);
  }
  await qi.removeColumn('fits', 'step_count');
}
