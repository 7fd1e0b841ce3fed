/**
 * Writes a sweep's points with the mariadb driver's batch insert on the transaction's own
 * connection: the bulk protocol instead of a statement per row.
 */
import type { Transaction } from 'sequelize';
import type { ConvertedPoint } from '../import-types';
import { requireAffected } from '../../../db/transient-errors';

const INSERT_POINTS =
  'INSERT INTO sweep_points (sweep_id, sequence, source_row, temperature_k, current_a, voltage_v, ' +
  'resistance_ohm, sheet_resistance_ohm_sq, resistivity_ohm_cm, raw, flags, quantities, ' +
  'site_x_mm, site_y_mm, site_label, edge_factor, leg) ' +
  'VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)';

const UPDATE_FLAGS = 'UPDATE sweep_points SET flags = ? WHERE sweep_id = ? AND sequence = ?';

/** The driver connection Sequelize holds for a transaction. */
interface BatchConnection {
  batch(sql: string, values: unknown[][]): Promise<unknown>;
  destroy(): void;
}

/**
 * Rows per batch call. The calls are pipelined on the connection, and the writer yields to the
 * event loop after each one, so the socket sends a chunk while the next is built and the
 * server inserts one while the next arrives (without the yield every chunk was built first
 * and sent after: 25 % slower for 100,000 rows). Only the rows of chunks not yet written are
 * held twice in memory.
 */
export const POINT_CHUNK = 10_000;

/**
 * Upper bound of one batch's encoded size, bytes. mariadb 3.0.2 mis-handles a bulk insert whose
 * last row spills past its packet limit (`maxAllowedPacket`, 4 MiB unless configured): the
 * batch rejects with a TypeError while its command stays at the head of the connection's
 * queue and swallows the answers to the statements after it. Chunks are cut below the limit.
 */
export const POINT_CHUNK_BYTES = 3 * 1024 * 1024;

/**
 * Bytes a row takes besides its raw text, flags, quantities and site label in the bulk
 * protocol, at most: seventeen null marks, four 4-byte integers, nine 8-byte doubles and four
 * length prefixes (up to 9 bytes each).
 */
const ROW_OVERHEAD_BYTES = 17 + 4 * 4 + 9 * 8 + 4 * 9;

/** Batches one writer keeps on the connection before it waits for the oldest to finish. */
export const POINT_BATCHES_IN_FLIGHT = 2;

/**
 * Writes a sweep's points as they are converted, slice by slice, numbering them on from the
 * points before. Each slice goes out as batch inserts pipelined on the transaction's
 * connection; the writer yields to the event loop after each so the socket sends it while the
 * next slice is converted, and it waits once `POINT_BATCHES_IN_FLIGHT` are outstanding, so
 * the conversion never runs far ahead of the database. Each batch must report every row it
 * sent as inserted. A failed batch fails the next `write` or `finish`, but only after every
 * batch sent has settled, so a rollback never races a write.
 */
export class PointWriter {
  private readonly connection: BatchConnection;
  private readonly inFlight: Array<Promise<void>> = [];
  private failure: { error: unknown } | null = null;
  /** Set by a batch that failed fatally: the connection must be closed once all have settled. */
  private fatal: 'pending' | 'closed' | null = null;
  private written = 0;

  constructor(
    private readonly sweepId: number,
    private readonly rawOf: (point: ConvertedPoint) => string,
    transaction: Transaction,
  ) {
    this.connection = (transaction as unknown as { connection: BatchConnection }).connection;
  }

  /** Sends `points` after those written before. */
  async write(points: ConvertedPoint[]): Promise<void> {
    await this.throwIfFailed();
    let start = 0;
    while (start < points.length) {
      const rows: unknown[][] = [];
      let bytes = 0;
      for (; start < points.length && rows.length < POINT_CHUNK; start++) {
        const p = points[start]!;
        const raw = this.rawOf(p);
        const flags = p.flags.length === 0 ? '' : p.flags.join(',');
        const quantities = p.quantities ? JSON.stringify(p.quantities) : null;
        // UTF-8 takes at most 3 bytes per UTF-16 unit: a bound, not an estimate.
        const site = p.site ?? null;
        bytes +=
          3 * (raw.length + (site?.label?.length ?? 0)) +
          flags.length +
          (quantities?.length ?? 0) +
          ROW_OVERHEAD_BYTES;
        if (bytes > POINT_CHUNK_BYTES && rows.length > 0) break;
        this.written += 1;
        rows.push([
          this.sweepId,
          this.written,
          p.sourceRows[0],
          p.temperatureK,
          p.currentA,
          p.voltageV,
          p.resistanceOhm,
          p.sheetResistanceOhmSq,
          p.resistivityOhmCm,
          raw,
          flags,
          quantities,
          site?.xMm ?? null,
          site?.yMm ?? null,
          site?.label ?? null,
          p.edgeFactor ?? null,
          p.leg ?? 1,
        ]);
      }
      this.send(INSERT_POINTS, rows, `points ${this.written - rows.length + 1} to ${this.written}`);
      await this.yieldAndWait();
    }
  }

  /**
   * Rewrites the flags of points already written, each given by its position (0-based, in
   * written order), to the point's flags now (late flags added after it was sent). Each row
   * must report itself changed: a late flag always lengthens the list.
   */
  async rewriteFlags(points: ConvertedPoint[], positions: number[]): Promise<void> {
    await this.throwIfFailed();
    for (let start = 0; start < positions.length; start += POINT_CHUNK) {
      const rows = positions.slice(start, start + POINT_CHUNK).map((i) => {
        if (i >= this.written) throw new Error(`point ${i + 1} was not written`);
        return [points[i]!.flags.join(','), this.sweepId, i + 1];
      });
      this.send(UPDATE_FLAGS, rows, `the late flags of ${rows.length} point(s)`);
      await this.yieldAndWait();
    }
  }

  /** Waits for every batch; resolves with the number of points written. */
  async finish(): Promise<number> {
    await this.settle();
    await this.throwIfFailed();
    return this.written;
  }

  /**
   * Waits for every batch sent, ignoring failures (before a rollback), then closes the
   * connection if one failed fatally.
   */
  async settle(): Promise<void> {
    while (this.inFlight.length) await this.inFlight.shift();
    if (this.fatal === 'pending') {
      this.fatal = 'closed';
      this.connection.destroy();
    }
  }

  /** Lets the socket send the batch just queued; waits while too many are outstanding. */
  private async yieldAndWait(): Promise<void> {
    await new Promise((resolve) => setImmediate(resolve));
    while (this.inFlight.length > POINT_BATCHES_IN_FLIGHT) await this.inFlight.shift();
    await this.throwIfFailed();
  }

  private send(sql: string, rows: unknown[][], what: string): void {
    this.inFlight.push(
      this.connection.batch(sql, rows).then(
        (result) => {
          try {
            requireAffected(result, rows.length, what);
          } catch (error) {
            this.failure ??= { error };
          }
        },
        (error: unknown) => {
          this.failure ??= { error };
          // A fatal error (SQLSTATE 08..., e.g. Galera's 1047) ends mariadb 3.0.2's bulk command
          // while answers to its other packets are still due; they would be taken by the next
          // statements (a ROLLBACK "succeeding" on a stray OK) and the connection would go back
          // to the pool out of step. Closing it makes the server roll the transaction back. It is
          // closed once the batches sent after it have settled (`settle`, before any other
          // statement): 3.0.2's destroy() with a command still awaiting its answer throws inside
          // the driver (a TypeError, unhandled) and leaves the socket open.
          if ((error as { fatal?: unknown } | null)?.fatal === true) this.fatal ??= 'pending';
        },
      ),
    );
  }

  private async throwIfFailed(): Promise<void> {
    if (!this.failure) return;
    await this.settle();
    throw this.failure.error;
  }
}
