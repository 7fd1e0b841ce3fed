/**
 * Writes a sweep's points with the mariadb driver's batch insert on the transaction's own
 * connection: the bulk protocol instead of a statement per row.
 */
import type { Transaction } from 'sequelize';
import type { ConvertedPoint } from '../import-types';
import { requireAffected } from '../../../db/transient-errors';

/** Every point's columns after its sweep id, then those only a map or a Hall sweep fills. */
const POINT_COLUMNS = [
  'sequence',
  'source_row',
  'temperature_k',
  'current_a',
  'voltage_v',
  'resistance_ohm',
  'sheet_resistance_ohm_sq',
  'resistivity_ohm_cm',
  'raw',
  'flags',
  'leg',
];
const SITE_COLUMNS = ['site_x_mm', 'site_y_mm', 'site_label', 'edge_factor'];
const QUANTITY_COLUMNS = ['quantities'];
/** Every column the writer may fill besides the sweep id (the upload bench loads the same). */
export const WRITTEN_POINT_COLUMNS: readonly string[] = [
  ...POINT_COLUMNS,
  ...SITE_COLUMNS,
  ...QUANTITY_COLUMNS,
];

/**
 * The insert of a batch: the sweep id written once in the statement, and the site and quantity
 * columns (NULL unless given) only where the batch fills them. Every parameter costs the
 * driver its encoding on each row: six fewer per row of a plain sweep saved about a third of it.
 */
function insertPoints(sweepId: number, sites: boolean, quantities: boolean): string {
  const columns = [
    ...POINT_COLUMNS,
    ...(sites ? SITE_COLUMNS : []),
    ...(quantities ? QUANTITY_COLUMNS : []),
  ];
  return (
    `INSERT INTO sweep_points (sweep_id, ${columns.join(', ')}) ` +
    `VALUES (${sweepId}, ${columns.map(() => '?').join(', ')})`
  );
}

const UPDATE_FLAGS = 'UPDATE sweep_points SET flags = ? WHERE sweep_id = ? AND sequence = ?';

/** The driver connection Sequelize holds for a transaction. */
interface BatchConnection {
  batch(sql: string, values: unknown[][]): Promise<unknown>;
  end(): Promise<void>;
}

/**
 * Rows per batch call. Each call goes to the driver once the one before has answered (see
 * `send`), and the writer yields to the event loop after queueing one, so the server inserts a
 * chunk while the next slice of the file is converted and built (without the yield every chunk
 * was built first and sent after: 25 % slower for 100,000 rows). Only the rows of chunks not
 * yet written are held twice in memory.
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
 * points before. Each slice goes out as batch inserts queued one behind the other on the
 * transaction's connection; the writer yields to the event loop after each so the server
 * inserts while the next slice is converted, and it waits once `POINT_BATCHES_IN_FLIGHT` are
 * outstanding, so
 * the conversion never runs far ahead of the database. Each batch must report every row it
 * sent as inserted. A failed batch fails the next `write` or `finish`, but only after every
 * batch sent has settled, so a rollback never races a write.
 */
export class PointWriter {
  private readonly connection: BatchConnection;
  private readonly inFlight: Array<Promise<void>> = [];
  private failure: { error: unknown } | null = null;
  /** The last batch queued (see `send`). */
  private last: Promise<void> = Promise.resolve();
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
    const sites = points.some((p) => p.site || (p.edgeFactor ?? null) !== null);
    const hall = points.some((p) => p.quantities);
    const sql = insertPoints(this.sweepId, sites, hall);
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
        const row: unknown[] = [
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
          p.leg ?? 1,
        ];
        if (sites) {
          row.push(site?.xMm ?? null, site?.yMm ?? null, site?.label ?? null, p.edgeFactor ?? null);
        }
        if (hall) row.push(quantities);
        rows.push(row);
      }
      this.send(sql, rows, `points ${this.written - rows.length + 1} to ${this.written}`);
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

  /** Waits for every batch sent, ignoring failures (before a rollback). */
  async settle(): Promise<void> {
    while (this.inFlight.length) await this.inFlight.shift();
  }

  /** Lets the socket send the batch just queued; waits while too many are outstanding. */
  private async yieldAndWait(): Promise<void> {
    await new Promise((resolve) => setImmediate(resolve));
    while (this.inFlight.length > POINT_BATCHES_IN_FLIGHT) await this.inFlight.shift();
    await this.throwIfFailed();
  }

  /**
   * Queues a batch behind the one before: it is handed to the driver once that one has its
   * answer, and not at all after a failure. mariadb 3.0.2's batch() prepares the statement and
   * queues the bulk execution only when the prepare answers, unless it takes the statement from
   * its cache, which it does at once whenever nothing waits to be sent: a batch handed over
   * later could then run before one handed over earlier (seen under load: point ids out of
   * sequence order, a late-flag update finding no row yet).
   */
  private send(sql: string, rows: unknown[][], what: string): void {
    this.last = this.last.then(() => (this.failure ? undefined : this.execute(sql, rows, what)));
    this.inFlight.push(this.last);
  }

  private execute(sql: string, rows: unknown[][], what: string): Promise<void> {
    return this.connection.batch(sql, rows).then(
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
        // to the pool out of step. Ending it refuses every later statement at once, and its
        // QUIT, sent after the batches already queued, makes the server roll the transaction
        // back. Not destroy(): in 3.0.2, with a batch still awaiting its answer, it throws
        // inside the driver (an unhandled TypeError) and leaves the socket open.
        if ((error as { fatal?: unknown } | null)?.fatal === true) {
          this.connection.end().catch(() => undefined);
        }
      },
    );
  }

  private async throwIfFailed(): Promise<void> {
    if (!this.failure) return;
    await this.settle();
    throw this.failure.error;
  }
}
