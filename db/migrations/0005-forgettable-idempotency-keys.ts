import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * station_idempotency_keys.idempotency_key may be null: the hourly chores forget a key once it is
 * older than the retention (`IDEMPOTENCY_KEEP_S`), so the station may use it again, while the row
 * stays as the record of which station post fulfilled which assignment. The unique key on
 * (station_id, idempotency_key) admits any number of nulls.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.changeColumn('station_idempotency_keys', 'idempotency_key', {
    type: DataTypes.STRING(255),
    allowNull: true,
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  // Forgotten keys get a stand-in unique per row, so the column can be required again.
  await qi.sequelize.query(
    "UPDATE station_idempotency_keys SET idempotency_key = CONCAT('forgotten-', id) " +
      'WHERE idempotency_key IS NULL',
  );
  await qi.changeColumn('station_idempotency_keys', 'idempotency_key', {
    type: DataTypes.STRING(255),
    allowNull: false,
  });
}
