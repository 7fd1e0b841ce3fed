/**
 * Writes a sweep's points with the mariadb driver's batch insert on the transaction's own
 * connection: one round of the bulk protocol instead of a statement per row.
 */
import type { Transaction } from 'sequelize';
import type { ConvertedPoint } from './convert';

const INSERT_POINTS =
  'INSERT INTO sweep_points (sweep_id, sequence, source_row, temperature_k, current_a, voltage_v, ' +
  'resistance_ohm, sheet_resistance_ohm_sq, resistivity_ohm_cm, raw, flags) ' +
  'VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)';

/** The driver connection Sequelize holds for a transaction. */
interface BatchConnection {
  batch(sql: string, values: unknown[][]): Promise<unknown>;
}

/** Rows per batch call, so one call's packet stays well under max_allowed_packet. */
const CHUNK = 50_000;

/**
 * Inserts the points of sweep `sweepId` inside `transaction`. `rawOf` gives each point's raw
 * JSON document.
 */
export async function insertPoints(
  sweepId: number,
  points: ConvertedPoint[],
  rawOf: (point: ConvertedPoint) => string,
  transaction: Transaction,
): Promise<void> {
  const connection = (transaction as unknown as { connection: BatchConnection }).connection;
  for (let start = 0; start < points.length; start += CHUNK) {
    const rows: unknown[][] = [];
    const end = Math.min(points.length, start + CHUNK);
    for (let i = start; i < end; i++) {
      const p = points[i]!;
      rows.push([
        sweepId,
        i + 1,
        p.sourceRows[0],
        p.temperatureK,
        p.currentA,
        p.voltageV,
        p.resistanceOhm,
        p.sheetResistanceOhmSq,
        p.resistivityOhmCm,
        rawOf(p),
        p.flags.join(','),
      ]);
    }
    await connection.batch(INSERT_POINTS, rows);
  }
}
