import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Wafer maps: where on the wafer each point was measured, and what the sweep records about the
 * map as a whole.
 * - sweep_points.site_x_mm, site_y_mm: the site, mm from the wafer centre (x to the right, y
 *   away from the flat or notch); null for a point of an ordinary (one-place) sweep.
 * - sweep_points.site_label: the site's name from the file or its pattern number; null when the
 *   file gave coordinates only.
 * - sweep_points.edge_factor: the edge factor the point's reading was divided by (1 far from
 *   the edge); null where no edge correction applies.
 * - sweeps.map_info: a JSON document, non-null exactly when the sweep is a map
 *   (`{ diameterMm, edgeExclusionMm, pattern, correction, probeSpacingMm }`, LONGTEXT like the
 *   other JSON columns). A point inside the edge exclusion carries the `edge-exclusion` flag.
 */
const double = { type: DataTypes.DOUBLE, allowNull: true };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('sweep_points', 'site_x_mm', double);
  await qi.addColumn('sweep_points', 'site_y_mm', double);
  await qi.addColumn('sweep_points', 'site_label', { type: DataTypes.STRING(64), allowNull: true });
  await qi.addColumn('sweep_points', 'edge_factor', double);
  await qi.addColumn('sweeps', 'map_info', { type: DataTypes.TEXT('long'), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('sweeps', 'map_info');
  await qi.removeColumn('sweep_points', 'edge_factor');
  await qi.removeColumn('sweep_points', 'site_label');
  await qi.removeColumn('sweep_points', 'site_y_mm');
  await qi.removeColumn('sweep_points', 'site_x_mm');
}
