import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Station computers post their sweeps themselves.
 * - station_tokens: bearer tokens of a probe station. Only the SHA-256 of a token is stored
 *   (a token holds 32 random bytes, so a fast hash suffices where a password needs a slow one);
 *   `prefix` is the first characters, shown so a person can tell tokens apart.
 * - station_idempotency_keys: one row per (station, Idempotency-Key), written in the same
 *   transaction as the sweep it stored, with the answer given, the sweep and the assignment. The unique key makes a second post with the same key
 *   wait for, or fail against, the first on one server and on every node of a Galera cluster
 *   (certification refuses the second writer), so it can never store a second sweep.
 * - assignments.station_id: the station an assignment is to be measured on (optional).
 * - sweeps.station_token_id: the token a station post came with (null for an ordinary upload).
 */
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false };
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete: 'RESTRICT',
  onUpdate: 'CASCADE',
});
const moment = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('station_tokens', {
    id,
    station_id: ref('stations'),
    label: { type: DataTypes.STRING(100), allowNull: false },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    token_sha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    created_by_id: ref('users'),
    last_used_at: moment(true),
    revoked_at: moment(true),
    revoked_by_id: ref('users', true),
    created_at: moment(),
    updated_at: moment(),
  });
  await qi.addIndex('station_tokens', ['station_id']);

  await qi.createTable('station_idempotency_keys', {
    id,
    station_id: ref('stations'),
    idempotency_key: { type: DataTypes.STRING(255), allowNull: false },
    /** SHA-256 of the file and the fields: the same key with another request is refused. */
    request_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    token_id: ref('station_tokens'),
    status: { type: DataTypes.SMALLINT, allowNull: false },
    response: { type: DataTypes.TEXT, allowNull: false },
    sweep_id: ref('sweeps', true),
    /** The assignment the post fulfilled (the worklist shows the station's upload by it). */
    assignment_id: ref('assignments', true),
    created_at: moment(),
  });
  await qi.addIndex('station_idempotency_keys', ['station_id', 'idempotency_key'], {
    unique: true,
    name: 'station_idempotency_station_key',
  });
  await qi.addIndex('station_idempotency_keys', ['created_at']);
  await qi.addIndex('station_idempotency_keys', ['assignment_id']);

  await qi.addColumn('assignments', 'station_id', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addConstraint('assignments', {
    type: 'foreign key',
    fields: ['station_id'],
    name: 'assignments_station_fk',
    references: { table: 'stations', field: 'id' },
    onDelete: 'RESTRICT',
    onUpdate: 'CASCADE',
  });
  await qi.addColumn('sweeps', 'station_token_id', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addConstraint('sweeps', {
    type: 'foreign key',
    fields: ['station_token_id'],
    name: 'sweeps_station_token_fk',
    references: { table: 'station_tokens', field: 'id' },
    onDelete: 'RESTRICT',
    onUpdate: 'CASCADE',
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeConstraint('sweeps', 'sweeps_station_token_fk');
  await qi.removeColumn('sweeps', 'station_token_id');
  await qi.removeConstraint('assignments', 'assignments_station_fk');
  await qi.removeColumn('assignments', 'station_id');
  await qi.dropTable('station_idempotency_keys');
  await qi.dropTable('station_tokens');
}
