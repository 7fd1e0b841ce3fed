/**
 * Preview and import of probe-station exports: parse, map, convert, and store the sweep, its raw
 * file, its points and the audit event in one transaction.
 */
import { createHash } from 'node:crypto';
import type {
  RowProblem,
  SessionUser,
  SweepColumn,
  SweepColumnOverride,
  SweepCreatedResponse,
  SweepGeometryInput,
  SweepMethod,
  SweepParseReport,
  SweepPreviewResponse,
} from '@rhotrace/api-types';
import { Transaction } from 'sequelize';
import { recordAudit } from '../audit/audit.service';
import { conflict, unprocessable, validationFailed } from '../errors';
import { Station } from '../stations/station.model';
import { uploadRawStorage } from '../storage/storage';
import type { RawStorage } from '../storage/raw-storage';
import { mayUploadTo } from '../access/visibility.service';
import { Wafer } from '../wafers/wafer.model';
import { RowConverter, requireColumns, type ConvertedPoint } from './convert';
import {
  applyColumnOverrides,
  MAX_PROBLEMS,
  openSweepFile,
  type OpenedSweepFile,
  parseSweepFile,
  readNumber,
  unreadableCells,
  UnreadableFileError,
  type ParsedSweepFile,
  type ResolvedColumn,
} from './parse';
import { SuspiciousPointFinder } from './point-flags';
import { POINT_CHUNK, PointWriter } from './point-writer';
import { resolveGeometry } from './sweep-geometry';
import { Sweep } from './sweep.model';

/** Rows the preview shows. */
export const PREVIEW_ROWS = 20;

/** What `importSweep` needs; the demo seeder calls it directly. */
export interface ImportSweepInput {
  waferId: number;
  file: Buffer;
  originalName: string;
  method: SweepMethod;
  stationId?: number | null;
  columns?: SweepColumnOverride[];
  geometry?: SweepGeometryInput;
}

/** The signed-in user, with the request id the audit event records. */
export type SweepActor = SessionUser & { requestId?: string | null };

/** Runs a step of reading the file, with its errors as the API's 400 or 422. */
function reading<T>(step: () => T): T {
  try {
    return step();
  } catch (error) {
    if (error instanceof UnreadableFileError) {
      throw error.status === 400
        ? validationFailed(error.message, [{ field: 'file', problem: error.message }])
        : unprocessable(error.message, [{ field: 'file', problem: error.message }]);
    }
    throw error;
  }
}

function readFile(file: Buffer): ParsedSweepFile {
  return reading(() => parseSweepFile(file));
}

function publicColumns(columns: ResolvedColumn[]): SweepColumn[] {
  return columns.map(({ index, header, meaning, unit, confidence }) => ({
    index,
    header,
    meaning,
    unit,
    confidence,
  }));
}

/** Parses without storing: layout, guessed columns, the first rows and the problems found. */
export async function previewSweep(
  input: { waferId: number; file: Buffer },
  actor: SweepActor,
): Promise<SweepPreviewResponse> {
  await mayUploadTo(actor, input.waferId);
  const parsed = readFile(input.file);
  const { layout, table } = parsed;
  const rows = table.records.slice(0, PREVIEW_ROWS).map((cells, i) => ({
    row: table.lines[i]!,
    cells,
    values: cells.map((c) => readNumber(c, layout.decimalMark) ?? null),
  }));
  return {
    delimiter: layout.delimiter,
    decimalMark: layout.decimalMark,
    metadata: layout.metadata,
    columns: publicColumns(parsed.columns),
    rows,
    rowCount: table.records.length,
    problems: [...parsed.problems, ...unreadableCells(parsed, parsed.columns)].slice(0, 50),
    suggestedMethod: parsed.suggestedMethod,
  };
}

async function findStation(
  stationId: number | null | undefined,
  stationName: string | undefined,
  warnings: string[],
  transaction: Transaction,
): Promise<Station | null> {
  if (stationId) {
    const station = await Station.findByPk(stationId, { transaction });
    if (!station) {
      throw validationFailed('The station does not exist', [
        { field: 'stationId', problem: `there is no station ${stationId}` },
      ]);
    }
    return station;
  }
  if (!stationName) return null;
  const station = await Station.findOne({ where: { name: stationName }, transaction });
  if (!station) {
    warnings.push(
      `the file names station "${stationName}", which is not registered; no station was linked`,
    );
  }
  return station;
}

/**
 * The raw JSON document of a point: the cells of its file row as read (an array), or for a
 * polarity pair `{ rows, cells }` with both rows. The header names are kept once, in the
 * sweep's column mapping; the read path rebuilds `[{ row, values: { header: cell } }]`.
 */
function rawJson(parsed: ParsedSweepFile): (p: ConvertedPoint) => string {
  const records = parsed.table.records;
  return (p) =>
    p.sourceRows.length === 1
      ? JSON.stringify(records[p.recordIndexes[0]!])
      : JSON.stringify({ rows: p.sourceRows, cells: p.recordIndexes.map((i) => records[i]) });
}

/** The 422 for rows that cannot be read (a wrong number of values). */
function unreadableRows(problems: RowProblem[]) {
  return unprocessable(
    'Some rows cannot be read; nothing was stored',
    problems.slice(0, MAX_PROBLEMS),
  );
}

/** Positions (0-based, in stored order) of the points to mark per update statement. */
const REVERSAL_UPDATE_ROWS = 5_000;

/** Adds the `temperature-reversal` flag to the points at `positions` (after any flags they have). */
async function markReversals(
  sweepId: number,
  positions: number[],
  transaction: Transaction,
): Promise<void> {
  for (let start = 0; start < positions.length; start += REVERSAL_UPDATE_ROWS) {
    const sequences = positions.slice(start, start + REVERSAL_UPDATE_ROWS).map((i) => i + 1);
    await Sweep.sequelize!.query(
      "UPDATE sweep_points SET flags = IF(flags = '', 'temperature-reversal', " +
        "CONCAT(flags, ',temperature-reversal')) WHERE sweep_id = ? AND sequence IN (?)",
      { replacements: [sweepId, sequences], transaction },
    );
  }
}

/** Removes an object-store copy whose transaction did not commit; never masks the cause. */
async function discardRaw(storage: RawStorage, key: Promise<string>): Promise<void> {
  try {
    await storage.delete(await key);
  } catch {
    // The put itself failed (nothing stored) or the store is unreachable: the import's own
    // error is what the caller must see; an orphaned object holds no sweep data.
  }
}

/**
 * Imports a sweep file onto a wafer as `actor`. Stores everything or nothing; throws the
 * API's errors (404 hidden wafer, 400 mapping or geometry, 409 duplicate, 422 unreadable rows).
 * The raw file goes to `options.storage`, by default the configured one (`RAW_STORAGE`). An
 * object store's copy is written before the transaction commits and deleted again when the
 * transaction rolls back or the import fails.
 */
export async function importSweep(
  input: ImportSweepInput,
  actor: SweepActor,
  options: { storage?: RawStorage } = {},
): Promise<SweepCreatedResponse> {
  const storage = options.storage ?? uploadRawStorage();
  // the rest of the file is read slice by slice while the first slices are stored
  const file = reading(() => openSweepFile(input.file, IMPORT_SLICE_ROWS));
  const parsed = file.parsed;
  const mapped = applyColumnOverrides(parsed.columns, input.columns ?? []);
  if (mapped.problems.length)
    throw validationFailed('The column mapping is not valid', mapped.problems);
  const columns = mapped.columns;
  const constantCurrentA = parsed.recognised.currentA;
  requireColumns(input.method, columns, constantCurrentA);
  if (parsed.problems.length) throw unreadableRows(parsed.problems);
  const sha256 = createHash('sha256').update(input.file).digest('hex');
  const sequelize = Sweep.sequelize!;

  /** The raw write, once started; an object store's copy is removed if nothing commits. */
  let rawKey: Promise<string> | null = null;
  try {
    return await sequelize.transaction(async (transaction) => {
      const { wafer, lot } = await mayUploadTo(actor, input.waferId, transaction);
      // Serialises uploads to one wafer, so two copies of a file cannot both pass the check.
      await Wafer.findByPk(wafer.id, { transaction, lock: Transaction.LOCK.UPDATE });
      const earlier = await Sweep.findOne({ where: { waferId: wafer.id, sha256 }, transaction });
      if (earlier) {
        throw conflict(`This file was already uploaded to this wafer as sweep ${earlier.id}`, {
          sweepId: earlier.id,
        });
      }
      // The raw bytes go to the store first (awaited in storeSweep).
      const put = storage.put(input.file, { transaction });
      rawKey = put;
      put.catch(() => undefined); // awaited below; never an unhandled rejection
      try {
        return await storeSweep(
          { input, actor, file, columns, sha256, storage, rawKey: put, wafer, lot },
          transaction,
        );
      } catch (error) {
        // The write in flight finishes before the rollback runs on the same connection.
        await put.catch(() => undefined);
        throw error;
      }
    });
  } catch (error) {
    if (rawKey && !storage.writesInTransaction) await discardRaw(storage, rawKey);
    throw error;
  }
}

/** What the transaction's work needs once the duplicate check passed and the raw write began. */
interface StoreContext {
  input: ImportSweepInput;
  actor: SweepActor;
  file: OpenedSweepFile;
  columns: ResolvedColumn[];
  sha256: string;
  storage: RawStorage;
  rawKey: Promise<string>;
  wafer: Wafer;
  lot: Awaited<ReturnType<typeof mayUploadTo>>['lot'];
}

/** Records converted per slice: one slice is stored while the next is converted. */
export const IMPORT_SLICE_ROWS = POINT_CHUNK;

/**
 * Converts the rows and stores the sweep, its points and the audit event. The conversion and
 * the point writes overlap slice by slice (the database inserts one slice while this process
 * converts the next); a row problem anywhere still stores nothing, since the caller's
 * transaction rolls back. The sweep row is written with the first slice and completed (count,
 * temperature range, report) after the last; points that go against the ramp, known only
 * then, get their flag in one update.
 */
async function storeSweep(
  { input, actor, file, columns, sha256, storage, rawKey, wafer, lot }: StoreContext,
  transaction: Transaction,
): Promise<SweepCreatedResponse> {
  const parsed = file.parsed;
  const constantCurrentA = parsed.recognised.currentA;
  const warnings: string[] = [];
  const station = await findStation(
    input.stationId,
    parsed.recognised.stationName,
    warnings,
    transaction,
  );
  const tCol = columns.find((c) => c.meaning === 'temperature')!;
  const geometry = resolveGeometry({
    method: input.method,
    request: input.geometry ?? {},
    wafer,
    lot,
    station,
    file: parsed.recognised,
    needsRtd: tCol.unitInfo?.kind === 'resistance',
  });
  const converter = new RowConverter(parsed, columns, input.method, geometry, constantCurrentA);
  const finder = new SuspiciousPointFinder();
  let minK = Infinity;
  let maxK = -Infinity;
  let stored: { sweep: Sweep; writer: PointWriter } | null = null;
  const take = async (points: ConvertedPoint[]) => {
    for (const p of points) {
      finder.add(p);
      if (p.temperatureK < minK) minK = p.temperatureK;
      if (p.temperatureK > maxK) maxK = p.temperatureK;
    }
    if (!points.length) return;
    if (!stored) {
      const sweep = await Sweep.create(
        {
          waferId: wafer.id,
          stationId: station?.id ?? null,
          method: input.method,
          geometry,
          uploadedById: actor.id,
          originalName: input.originalName.slice(0, 255) || 'sweep.csv',
          sizeBytes: input.file.length,
          sha256,
          storageKind: storage.kind,
          storageKey: await rawKey,
          columnMapping: publicColumns(columns),
          metadata: parsed.layout.metadata,
          parseReport: {},
          pointCount: 0,
          minTemperatureK: null,
          maxTemperatureK: null,
          deletedById: null,
        },
        { transaction },
      );
      stored = { sweep, writer: new PointWriter(sweep.id, rawJson(parsed), transaction) };
    }
    await stored.writer.write(points);
  };
  const records = parsed.table.records;
  try {
    for (let start = 0; converter.open; start += IMPORT_SLICE_ROWS) {
      const end = start + IMPORT_SLICE_ROWS;
      while (!file.done && records.length < end) reading(() => file.readMore(IMPORT_SLICE_ROWS));
      if (parsed.problems.length) break;
      if (start >= records.length) break;
      const more = !file.done || end < records.length;
      await take(converter.next(start, Math.min(records.length, end), more));
    }
    if (parsed.problems.length) {
      // a row of the wrong width: read on only to name the others, as a whole-file read would
      while (!file.done && parsed.problems.length < MAX_PROBLEMS) {
        reading(() => file.readMore(IMPORT_SLICE_ROWS));
      }
      throw unreadableRows(parsed.problems);
    }
    await take(converter.finish());
    if (converter.problems.length) {
      throw unprocessable(
        'Some rows hold values that cannot be stored; nothing was stored',
        converter.problems.slice(0, MAX_PROBLEMS),
      );
    }
  } catch (error) {
    // every batch sent settles before the caller's rollback runs on the same connection
    await (stored as { writer: PointWriter } | null)?.writer.settle();
    throw error;
  }
  const { sweep, writer } = stored!;
  const pointCount = await writer.finish();
  const flags = finder.finish();
  await markReversals(sweep.id, flags.reversals, transaction);
  warnings.push(...converter.warnings, ...flags.warnings);
  const parseReport: SweepParseReport = {
    delimiter: parsed.layout.delimiter,
    decimalMark: parsed.layout.decimalMark,
    headerRow: parsed.layout.headerLine,
    rowCount: records.length,
    warnings,
    flaggedPoints: flags.flagged,
  };
  await sweep.update(
    { pointCount, minTemperatureK: minK, maxTemperatureK: maxK, parseReport },
    { transaction },
  );
  await recordAudit(
    {
      actorId: actor.id,
      action: 'create',
      entity: 'sweep',
      entityId: sweep.id,
      after: {
        waferId: wafer.id,
        method: input.method,
        originalName: sweep.originalName,
        sha256,
        pointCount,
        stationId: sweep.stationId,
        geometry,
      },
      requestId: actor.requestId ?? null,
    },
    transaction,
  );
  return { id: sweep.id, pointCount, warnings };
}
