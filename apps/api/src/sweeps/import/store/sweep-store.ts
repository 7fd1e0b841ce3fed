/**
 * Stage 7, store: the sweep row, its points (each with its leg, written as soon as the leg is
 * settled; flags found over the whole sweep rewritten on those already written), the completed row
 * and the audit event, in the upload's transaction, with every statement's result checked before the
 * commit. The sweep row is written only while a transaction is open, the points need it (a
 * foreign key), and the audit event is written only where the sweep and all its points are
 * visible; the last statement checks the transaction is still open. A transaction that lost
 * its writes (on Galera, an abort whose error went unseen) is a `TransactionLostError`, so
 * nothing commits and the upload is retried.
 */
import type {
  SweepColumn,
  SweepGeometry,
  SweepMapInfo,
  SweepMethod,
  SweepParseReport,
} from '@rhotrace/api-types';
import { QueryTypes, type Transaction } from 'sequelize';
import { recordAuditWhen, type AuditEntry } from '../../../audit/audit.service';
import { requireAffected, TransactionLostError } from '../../../db/transient-errors';
import { Sweep } from '../../sweep.model';
import type { FlagSummary } from '../flag';
import type { ConvertedPoint } from '../import-types';
import type { ParsedSweepFile } from '../../parse';
import { PointWriter } from './point-writer';

/** The sweep row as known before its points. */
export interface SweepDraft {
  waferId: number;
  stationId: number | null;
  method: SweepMethod;
  geometry: SweepGeometry;
  uploadedById: number;
  originalName: string;
  sizeBytes: number;
  sha256: string;
  storageKind: string;
  /** The raw file's key, once its write finished. */
  storageKey: Promise<string>;
  columnMapping: SweepColumn[];
  metadata: Record<string, string>;
  /** Set for a wafer map. */
  mapInfo: SweepMapInfo | null;
}

/**
 * The number of the sweep's points visible in the transaction (replacements: sweep id three
 * times, then the last sequence). The points were inserted in sequence order on one connection,
 * so their ids rise with their sequence and all lie between the ids of the first and the last;
 * counting that stretch of the primary key reads each row once, where counting through the
 * (sweep_id, sequence) index checks each uncommitted row against the clustered index (measured
 * 21 ms against 106 ms for 100,000 points). A missing first or last point counts 0.
 */
const COUNT_POINTS =
  'SELECT COUNT(*) FROM sweep_points USE INDEX (PRIMARY) WHERE sweep_id = ? AND id BETWEEN ' +
  '(SELECT id FROM sweep_points WHERE sweep_id = ? AND sequence = 1) AND ' +
  '(SELECT id FROM sweep_points WHERE sweep_id = ? AND sequence = ?)';

/** Stores one sweep; `write` as slices are converted, then `complete` or `abandon`. */
export class SweepStore {
  private sweepId: number | null = null;
  private writer: PointWriter | null = null;

  constructor(
    private readonly draft: SweepDraft,
    private readonly rawOf: (point: ConvertedPoint) => string,
    private readonly transaction: Transaction,
  ) {}

  /** Writes `points` after those before (the sweep row goes first, with the first points). */
  async write(points: ConvertedPoint[]): Promise<void> {
    if (!points.length) return;
    if (!this.writer) {
      this.sweepId = await this.insertSweep();
      this.writer = new PointWriter(this.sweepId, this.rawOf, this.transaction);
    }
    await this.writer.write(points);
  }

  /**
   * Rewrites the flags of points written before their late flags were known (positions 0-based,
   * in written order) to the flags they carry now.
   */
  async rewriteFlags(points: ConvertedPoint[], positions: number[]): Promise<void> {
    if (positions.length) await this.writer!.rewriteFlags(points, positions);
  }

  /** Waits for every write sent, so the caller's rollback never races one. */
  async abandon(): Promise<void> {
    await this.writer?.settle();
  }

  /**
   * Completes the sweep (count, temperature range, report) and writes the audit
   * event `audit` describes (its entity id is the sweep's). Resolves with the id and count.
   */
  async complete(
    flags: FlagSummary,
    parseReport: SweepParseReport,
    audit: (sweepId: number, pointCount: number) => AuditEntry,
  ): Promise<{ id: number; pointCount: number }> {
    const id = this.sweepId!;
    const pointCount = await this.writer!.finish();
    const [updated] = await Sweep.update(
      {
        pointCount,
        minTemperatureK: flags.minTemperatureK,
        maxTemperatureK: flags.maxTemperatureK,
        parseReport,
      },
      { where: { id }, transaction: this.transaction },
    );
    requireAffected(updated, 1, 'completing the sweep row');
    const written = await recordAuditWhen(
      audit(id, pointCount),
      {
        sql:
          '@@in_transaction = 1 AND EXISTS (SELECT 1 FROM sweeps WHERE id = ? AND point_count = ?)' +
          ` AND (${COUNT_POINTS}) = ?` +
          " AND (? <> 'db' OR EXISTS (SELECT 1 FROM raw_files WHERE storage_key = ?))",
        replacements: [
          id,
          pointCount,
          id,
          id,
          id,
          pointCount,
          pointCount,
          this.draft.storageKind,
          await this.draft.storageKey,
        ],
      },
      this.transaction,
    );
    requireAffected(written, 1, 'the audit event, written only beside the whole sweep');
    await this.requireOpenTransaction();
    return { id, pointCount };
  }

  /** Inserts the sweep row, only inside an open transaction (never in autocommit). */
  private async insertSweep(): Promise<number> {
    const d = this.draft;
    const now = new Date();
    const [id, inserted] = await Sweep.sequelize!.query(
      'INSERT INTO sweeps (wafer_id, station_id, method, geometry, uploaded_by_id, original_name, ' +
        'size_bytes, sha256, storage_kind, storage_key, column_mapping, metadata, parse_report, ' +
        'point_count, created_at, updated_at, map_info) ' +
        "SELECT ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, '{}', 0, ?, ?, ? FROM DUAL WHERE @@in_transaction = 1",
      {
        replacements: [
          d.waferId,
          d.stationId,
          d.method,
          JSON.stringify(d.geometry),
          d.uploadedById,
          d.originalName,
          d.sizeBytes,
          d.sha256,
          d.storageKind,
          await d.storageKey,
          JSON.stringify(d.columnMapping),
          JSON.stringify(d.metadata),
          now,
          now,
          d.mapInfo === null ? null : JSON.stringify(d.mapInfo),
        ],
        type: QueryTypes.INSERT,
        transaction: this.transaction,
      },
    );
    requireAffected(inserted, 1, 'the sweep row, written only inside the transaction');
    return Number(id);
  }

  /** The last statement before the commit: the transaction must still be open. */
  private async requireOpenTransaction(): Promise<void> {
    const rows = await Sweep.sequelize!.query<{ open: number | bigint }>(
      'SELECT @@in_transaction AS open',
      { type: QueryTypes.SELECT, transaction: this.transaction },
    );
    if (Number(rows[0]?.open) !== 1) {
      throw new TransactionLostError('the transaction was closed before its commit');
    }
  }
}

/**
 * The raw JSON document of a point: the cells of its file row as read (an array), or for a
 * polarity pair `{ rows, cells }` with both rows. The header names are kept once, in the
 * sweep's column mapping; the read path rebuilds `[{ row, values: { header: cell } }]`.
 */
export function rawJson(parsed: ParsedSweepFile): (p: ConvertedPoint) => string {
  const records = parsed.table.records;
  return (p) =>
    p.sourceRows.length === 1
      ? JSON.stringify(records[p.recordIndexes[0]!])
      : JSON.stringify({ rows: p.sourceRows, cells: p.recordIndexes.map((i) => records[i]) });
}
