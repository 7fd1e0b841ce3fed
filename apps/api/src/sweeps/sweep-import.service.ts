/**
 * Preview and import of probe-station exports: parse, map, convert, and store the sweep, its raw
 * file, its points and the audit event in one transaction.
 */
import { createHash } from 'node:crypto';
import type {
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
import { visibleWafer } from '../wafers/wafer-access.service';
import { Wafer } from '../wafers/wafer.model';
import { convertRows, requireColumns, type ConvertedPoint } from './convert';
import {
  applyColumnOverrides,
  parseSweepFile,
  readNumber,
  unreadableCells,
  UnreadableFileError,
  type ParsedSweepFile,
  type ResolvedColumn,
} from './parse';
import { insertPoints } from './point-writer';
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

function readFile(file: Buffer): ParsedSweepFile {
  try {
    return parseSweepFile(file);
  } catch (error) {
    if (error instanceof UnreadableFileError) {
      throw error.status === 400
        ? validationFailed(error.message, [{ field: 'file', problem: error.message }])
        : unprocessable(error.message, [{ field: 'file', problem: error.message }]);
    }
    throw error;
  }
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
  await visibleWafer(actor, input.waferId);
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
  const parsed = readFile(input.file);
  const mapped = applyColumnOverrides(parsed.columns, input.columns ?? []);
  if (mapped.problems.length)
    throw validationFailed('The column mapping is not valid', mapped.problems);
  const columns = mapped.columns;
  const constantCurrentA = parsed.recognised.currentA;
  requireColumns(input.method, columns, constantCurrentA);
  if (parsed.problems.length) {
    throw unprocessable(
      'Some rows cannot be read; nothing was stored',
      parsed.problems.slice(0, 50),
    );
  }
  const sha256 = createHash('sha256').update(input.file).digest('hex');
  const sequelize = Sweep.sequelize!;

  /** The raw write, once started; an object store's copy is removed if nothing commits. */
  let rawKey: Promise<string> | null = null;
  try {
    return await sequelize.transaction(async (transaction) => {
      const { wafer, lot } = await visibleWafer(actor, input.waferId, transaction);
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
          { input, actor, parsed, columns, sha256, storage, rawKey: put, wafer, lot },
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
  parsed: ParsedSweepFile;
  columns: ResolvedColumn[];
  sha256: string;
  storage: RawStorage;
  rawKey: Promise<string>;
  wafer: Wafer;
  lot: Awaited<ReturnType<typeof visibleWafer>>['lot'];
}

/** Converts the rows and stores the sweep, its points and the audit event. */
async function storeSweep(
  { input, actor, parsed, columns, sha256, storage, rawKey, wafer, lot }: StoreContext,
  transaction: Transaction,
): Promise<SweepCreatedResponse> {
  const constantCurrentA = parsed.recognised.currentA;
  const warnings: string[] = [];
  // The raw bytes are written before the rows are converted: conversion keeps the event loop
  // busy, and a write still queued in this process would only reach the store afterwards.
  const storageKey = await rawKey;
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
  const converted = convertRows(parsed, columns, input.method, geometry, constantCurrentA);
  if (converted.problems.length) {
    throw unprocessable(
      'Some rows hold values that cannot be stored; nothing was stored',
      converted.problems,
    );
  }
  warnings.push(...converted.warnings);
  const points = converted.points;
  let minK = Infinity;
  let maxK = -Infinity;
  for (const p of points) {
    if (p.temperatureK < minK) minK = p.temperatureK;
    if (p.temperatureK > maxK) maxK = p.temperatureK;
  }
  const parseReport: SweepParseReport = {
    delimiter: parsed.layout.delimiter,
    decimalMark: parsed.layout.decimalMark,
    headerRow: parsed.layout.headerLine,
    rowCount: parsed.table.records.length,
    warnings,
    flaggedPoints: points.filter((p) =>
      p.flags.some((f) => f === 'jump' || f === 'temperature-reversal'),
    ).length,
  };
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
      storageKey,
      columnMapping: publicColumns(columns),
      metadata: parsed.layout.metadata,
      parseReport,
      pointCount: points.length,
      minTemperatureK: minK,
      maxTemperatureK: maxK,
      deletedById: null,
    },
    { transaction },
  );
  await insertPoints(sweep.id, points, rawJson(parsed), transaction);
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
        pointCount: points.length,
        stationId: sweep.stationId,
        geometry,
      },
      requestId: actor.requestId ?? null,
    },
    transaction,
  );
  return { id: sweep.id, pointCount: points.length, warnings };
}
