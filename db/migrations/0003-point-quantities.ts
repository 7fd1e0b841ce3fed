import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * `sweep_points.quantities`: one JSON document per point holding the measured and derived
 * quantities beyond resistivity, keys camelCase with the unit in the name (a Hall sweep's
 * `hallCoefficientCm3PerC`, `carrierDensityCm3`, `sheetCarrierDensityCm2`,
 * `hallMobilityCm2PerVs`, `carrierType`, `magneticFieldT`, `hallVoltageV`).
 *
 * Why one document and not a column per quantity: each new measurement (Hall today, Seebeck or
 * magnetoresistance tomorrow) would otherwise widen every row of the largest table for all
 * sweeps, most of which never use it. A key-value side table would cost a join and a row per
 * quantity per point on the hot sweep read. The document is read together with the point it
 * belongs to (the read is one range scan on (sweep_id, sequence), as before), it is NULL, so
 * one byte, for sweeps without such quantities, and no query filters on it: analyses of a
 * quantity read one sweep's points at a time. The API types list the known keys
 * (`PointQuantities`). LONGTEXT with a JSON check, as MariaDB's JSON type is.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('sweep_points', 'quantities', {
    type: DataTypes.TEXT('long'),
    allowNull: true,
  });
  await qi.sequelize.query(
    'ALTER TABLE sweep_points ADD CONSTRAINT sweep_points_quantities_json ' +
      'CHECK (quantities IS NULL OR JSON_VALID(quantities))',
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('ALTER TABLE sweep_points DROP CONSTRAINT sweep_points_quantities_json');
  await qi.removeColumn('sweep_points', 'quantities');
}
