import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * fits.model_version grows from 32 to 96 characters: a carrier-density fit's version
 * (`physics@0.1.0+Si:si-scaled-t15:constant-level`) and the Hall power law's were cut at 32,
 * so the stored version no longer named the model that ran.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.changeColumn('fits', 'model_version', { type: DataTypes.STRING(96), allowNull: false });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.changeColumn('fits', 'model_version', { type: DataTypes.STRING(32), allowNull: false });
}
