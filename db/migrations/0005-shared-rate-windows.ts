import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * rate_windows: one row per rate-limited key (today: one per station token) with the hits counted
 * in its current window and when that window ends. Kept in the database so that every API
 * instance, on every Galera node, counts against the same limit; a row is reused when its window
 * has passed, so the table holds one row per key and needs no purge.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('rate_windows', {
    rate_key: { type: DataTypes.STRING(191), primaryKey: true, allowNull: false },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    resets_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('rate_windows');
}
