import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Saved import settings: how files of one shape from one probe station are read, so the next
 * file of that shape is preset without the mapping step being done again.
 * - station_id: the station the files come from.
 * - shape_sha256: sha256 of the file's shape (separator, column count and header cells, as
 *   `sweeps/import/file-shape.ts` writes it); shape_label says the same in words.
 * - method, columns (JSON list of { index, meaning, unit }), geometry (JSON, cm) and layout
 *   (JSON { delimiter, decimalMark }, the corrected ones only): the upload's own fields.
 * One row per station and shape; saving again replaces it (with an audit event).
 */
const json = { type: DataTypes.TEXT('long'), allowNull: false };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('import_settings', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false },
    station_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'stations', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    shape_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    shape_label: { type: DataTypes.STRING(500), allowNull: false },
    method: { type: DataTypes.STRING(32), allowNull: false },
    columns: json,
    geometry: json,
    layout: json,
    saved_by_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
      onUpdate: 'CASCADE',
    },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('import_settings', ['station_id', 'shape_sha256'], {
    unique: true,
    name: 'import_settings_station_shape',
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('import_settings');
}
