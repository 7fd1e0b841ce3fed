import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * wafers.counted_sweep_id: the sweep an engineer chose to give the wafer its 23 °C value and
 * verdict. Null means the newest sweep that reaches 23 °C counts (the earlier rule).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('wafers', 'counted_sweep_id', {
    type: DataTypes.INTEGER,
    allowNull: true,
    references: { model: 'sweeps', key: 'id' },
    onDelete: 'SET NULL',
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('wafers', 'counted_sweep_id');
}
