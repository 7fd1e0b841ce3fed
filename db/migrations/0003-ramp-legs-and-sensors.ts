import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Ramp legs and station sensors.
 * - sweep_points.leg: the ramp leg (1, 2, ...) a point belongs to, set by the import's flag
 *   stage; null on points imported before legs existed (read as one leg).
 * - stations.sensor: the station's thermometer as one JSON value,
 *   `{ kind: 'platinum-rtd', r0Ohm }`, `{ kind: 'thermocouple', type?, referenceJunctionK? }` or
 *   `{ kind: 'table', points: [{ reading, temperatureK }] }`. Filled here from `thermometer` and
 *   `rtd_r0_ohm` (a Pt100 where R0 was not stated, as the import assumed; a thermocouple's type
 *   was never recorded, so it stays unset until someone states it). `thermometer` stays as the
 *   sensor's kind for the older API field and gains 'table'; `rtd_r0_ohm` mirrors `r0Ohm`.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('sweep_points', 'leg', { type: DataTypes.SMALLINT, allowNull: true });
  await qi.addColumn('stations', 'sensor', { type: DataTypes.JSON, allowNull: true });
  await qi.changeColumn('stations', 'thermometer', {
    type: DataTypes.ENUM('thermocouple', 'platinum-rtd', 'table'),
    allowNull: false,
  });
  await qi.sequelize.query(
    "UPDATE stations SET sensor = JSON_OBJECT('kind', 'platinum-rtd', 'r0Ohm', " +
      "COALESCE(rtd_r0_ohm, 100)) WHERE thermometer = 'platinum-rtd'",
  );
  await qi.sequelize.query(
    "UPDATE stations SET sensor = JSON_OBJECT('kind', 'thermocouple') WHERE thermometer = 'thermocouple'",
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    "UPDATE stations SET thermometer = 'platinum-rtd' WHERE thermometer = 'table'",
  );
  await qi.changeColumn('stations', 'thermometer', {
    type: DataTypes.ENUM('thermocouple', 'platinum-rtd'),
    allowNull: false,
  });
  await qi.removeColumn('stations', 'sensor');
  await qi.removeColumn('sweep_points', 'leg');
}
