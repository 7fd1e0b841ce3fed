/**
 * Preview and import of probe-station exports. The import runs as named stages, each in
 * `import/`: read the table → detect columns → read a row → pair polarities → turn a row into a
 * point (one entry per measurement method) → flag → store. It converts and stores slice by
 * slice inside one transaction, so the database inserts one slice while the next is converted,
 * and stores the sweep, its raw file, its points and the audit event all together or not at
 * all. A transaction failure of the moment (a deadlock, a Galera certification failure or
 * abort) runs the whole upload once more; a second one is a 503.
 */
import { createHash } from 'node:crypto';
import {
  MAX_FINDINGS,
  type HallFactorName,
  type RowProblem,
  type SessionUser,
  type SweepColumnOverride,
  type SweepCreatedResponse,
  type SweepGeometryInput,
  type SweepMapInput,
  type SweepMethod,
  type StationSensor,
} from '@rhotrace/api-types';
import { Transaction } from 'sequelize';
import { retryTransientOnce, TransactionLostError } from '../db/transient-errors';
import { conflict, unprocessable } from '../errors';
import type { RawStorage } from '../storage/raw-storage';
import { mayUploadTo } from '../access/visibility.service';
import { uploadRawStorage } from '../storage/storage';
import { Wafer } from '../wafers/wafer.model';
import { RowConverter } from './import/convert-rows';
import { listRows, type ConvertedPoint } from './import/import-types';
import { detectColumns, publicColumns } from './import/detect-columns';
import { findStation } from './import/find-station';
import { SuspiciousPointFinder } from './import/flag';
import { HallSummary, hallSettings } from './import/hall-summary';
import { openTable, slices, unreadableRows } from './import/read-table';
import { POINT_CHUNK } from './import/store/point-writer';
import { RawCopy } from './import/store/raw-copy';
import { rawJson, SweepStore } from './import/store/sweep-store';
import { MAX_PROBLEMS, type OpenedSweepFile, type ResolvedColumn } from './parse';
import { resolveGeometry } from './import/resolve-geometry';
import { hasSites, SitePlacer } from './import/sites';
import { temperatureReader } from './import/temperature';
import type { Station } from '../stations/station.model';
import { toStationDto } from '../stations/stations.service';
import { Sweep } from './sweep.model';

/** Records converted per slice: one slice is stored while the next is converted. */
export const IMPORT_SLICE_ROWS = POINT_CHUNK;

/** What `importSweep` needs; the demo seeder calls it directly. */
export interface ImportSweepInput {
  waferId: number;
  file: Buffer;
  originalName: string;
  method: SweepMethod;
  stationId?: number | null;
  columns?: SweepColumnOverride[];
  geometry?: SweepGeometryInput;
  /** Map fields (site pattern, edge exclusion); used when the columns place readings at sites. */
  map?: SweepMapInput;
  /** Hall sweeps: r_H as a number or a named scattering factor (default 1). */
  hallFactor?: number | HallFactorName;
}

/** The signed-in user, with the request id the audit event records. */
export type SweepActor = SessionUser & { requestId?: string | null };

/**
 * Work a caller adds to the upload's own transaction (a station post records its key and
 * closes its assignment there), so it commits or rolls back with the sweep: `begin` runs
 * first, `commit` once the sweep is stored. Both run again if the upload is retried.
 */
export interface ImportHooks {
  begin?: (transaction: Transaction) => Promise<void>;
  commit?: (result: SweepCreatedResponse, transaction: Transaction) => Promise<void>;
}

/** RTD ohms need R0 unless the station reads its ohms through its own table. */
function needsRtd(columns: ResolvedColumn[], station: Station | null): boolean {
  const unit = columns.find((c) => c.meaning === 'temperature')?.unitInfo;
  return unit?.kind === 'resistance' && station?.sensor?.kind !== 'table';
}

/** The station's sensor (null without a station). */
export function stationSensor(station: Station | null): StationSensor | null {
  // a station written before sensors (or by a seeder) reads through its older fields
  return station ? (toStationDto(station).sensor ?? null) : null;
}

/**
 * Imports a sweep file onto a wafer as `actor`. Stores everything or nothing; throws the
 * API's errors (404 hidden wafer, 400 mapping or geometry, 409 duplicate, 422 unreadable rows,
 * 503 when the database refused it twice for reasons of the moment). The raw file goes to
 * `options.storage`, by default the configured one (`RAW_STORAGE`); `options.onRetry` hears of a
 * retried attempt.
 */
export async function importSweep(
  input: ImportSweepInput,
  actor: SweepActor,
  options: { storage?: RawStorage; onRetry?: (error: unknown) => void; hooks?: ImportHooks } = {},
): Promise<SweepCreatedResponse> {
  const storage = options.storage ?? uploadRawStorage();
  return retryTransientOnce(
    'upload',
    () => importOnce(input, actor, storage, options.hooks ?? {}).catch(lostSweepRow),
    options.onRetry,
  );
}

/**
 * A point batch refused for a missing parent (1452) can only mean the transaction lost the sweep
 * row it inserted itself: a Galera brute-force abort rolled it back and the batch ran outside it.
 * That is a lost transaction (retried, then 503), not a fault of the server.
 */
function lostSweepRow(error: unknown): never {
  const e = error as { errno?: number; original?: { errno?: number } } | null;
  if (e?.errno === 1452 || e?.original?.errno === 1452)
    throw new TransactionLostError('a point batch found no sweep row');
  throw error;
}

/** What the map stage noticed without refusing it. */
function mapWarnings(converter: RowConverter): string[] {
  const rows = converter.placer?.tipOffWafer ?? [];
  if (!rows.length) return [];
  return [
    `${rows.length} site(s) lie so near the edge that the probe's outer tip is off the wafer; ` +
      `they are kept but excluded, with the edge factor of a tip on the edge (rows ${listRows(rows)})`,
  ];
}

/** One attempt: the file is read again, so a retry starts from the same bytes. */
async function importOnce(
  input: ImportSweepInput,
  actor: SweepActor,
  storage: RawStorage,
  hooks: ImportHooks,
): Promise<SweepCreatedResponse> {
  const file = openTable(input.file, IMPORT_SLICE_ROWS);
  const columns = detectColumns(file.parsed, input.columns ?? [], input.method);
  if (file.parsed.problems.length) throw unreadableRows(file.parsed.problems);
  const sha256 = createHash('sha256').update(input.file).digest('hex');
  const raw = new RawCopy(storage);
  try {
    return await Sweep.sequelize!.transaction(async (transaction) => {
      await hooks.begin?.(transaction);
      const { wafer, lot } = await mayUploadTo(actor, input.waferId, transaction);
      // Serialises uploads to one wafer, so two copies of a file cannot both pass the check.
      await Wafer.findByPk(wafer.id, { transaction, lock: Transaction.LOCK.UPDATE });
      const earlier = await Sweep.findOne({ where: { waferId: wafer.id, sha256 }, transaction });
      if (earlier) {
        throw conflict(`This file was already uploaded to this wafer as sweep ${earlier.id}`, {
          sweepId: earlier.id,
        });
      }
      const rawKey = raw.put(input.file, transaction);
      try {
        const result = await storeSweep(
          { input, actor, file, columns, sha256, storage, rawKey, wafer, lot },
          transaction,
        );
        await hooks.commit?.(result, transaction);
        return result;
      } catch (error) {
        await raw.settle();
        throw error;
      }
    });
  } catch (error) {
    await raw.discard();
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

/**
 * Runs the stages over the file slice by slice and stores the result. A row problem anywhere
 * stores nothing, since the caller's transaction rolls back.
 */
async function storeSweep(
  ctx: StoreContext,
  transaction: Transaction,
): Promise<SweepCreatedResponse> {
  const { input, actor, file, columns, sha256, storage, rawKey, wafer, lot } = ctx;
  const parsed = file.parsed;
  const warnings: string[] = [];
  const station = await findStation(
    input.stationId,
    parsed.recognised.stationName,
    warnings,
    transaction,
  );
  const geometry = resolveGeometry({
    method: input.method,
    request: input.geometry ?? {},
    wafer,
    lot,
    station,
    file: parsed.recognised,
    needsRtd: needsRtd(columns, station),
    isMap: hasSites(columns),
  });
  const placer = hasSites(columns)
    ? (problems: RowProblem[]) =>
        new SitePlacer(input.map ?? {}, input.method, columns, geometry, problems)
    : null;
  const settings = hallSettings(input.method, input.hallFactor);
  const temperature = temperatureReader({
    column: columns.find((c) => c.meaning === 'temperature')!,
    referenceColumn: columns.some((c) => c.meaning === 'reference-junction'),
    sensor: stationSensor(station),
    file: parsed.recognised,
    geometry,
  });
  const converter = new RowConverter(
    parsed,
    columns,
    input.method,
    geometry,
    settings,
    placer,
    temperature,
  );
  const finder = new SuspiciousPointFinder();
  const reversals = columns.some((c) => c.meaning === 'hall-voltage-pp');
  const hall = input.method === 'hall' ? new HallSummary(settings, reversals) : null;
  const watch = (points: ConvertedPoint[]) => finder.addAll(hall ? hall.addAll(points) : points);
  const originalName = input.originalName.slice(0, 255) || 'sweep.csv';
  const store = new SweepStore(
    {
      waferId: wafer.id,
      stationId: station?.id ?? null,
      method: input.method,
      geometry,
      uploadedById: actor.id,
      originalName,
      sizeBytes: input.file.length,
      sha256,
      storageKind: storage.kind,
      storageKey: rawKey,
      columnMapping: publicColumns(columns),
      metadata: parsed.layout.metadata,
      mapInfo: converter.placer?.info ?? null,
    },
    rawJson(parsed),
    transaction,
  );
  try {
    // no slice is read once the converter holds as many problems as an answer lists
    for (const slice of slices(file, IMPORT_SLICE_ROWS, () => converter.open)) {
      await store.write(watch(converter.next(slice)));
    }
    await store.write(watch(converter.finish()));
    if (converter.problems.length) {
      throw unprocessable(
        'Some rows hold values that cannot be stored; nothing was stored',
        converter.problems.slice(0, MAX_PROBLEMS),
      );
    }
  } catch (error) {
    await store.abandon();
    throw error;
  }
  const flags = finder.finish();
  warnings.push(
    ...converter.warnings,
    ...flags.warnings,
    ...(hall?.warnings ?? []),
    ...mapWarnings(converter),
  );
  const report = {
    delimiter: parsed.layout.delimiter,
    decimalMark: parsed.layout.decimalMark,
    headerRow: parsed.layout.headerLine,
    rowCount: parsed.table.records.length,
    warnings,
    flaggedPoints: flags.flagged,
    findings: flags.findings.slice(0, MAX_FINDINGS),
    temperature: temperature.conversion,
    ...(hall ? { hall: hall.report } : {}),
  };
  const { id, pointCount } = await store.complete(flags, report, (sweepId, count) => ({
    actorId: actor.id,
    action: 'create',
    entity: 'sweep',
    entityId: sweepId,
    after: {
      waferId: wafer.id,
      method: input.method,
      originalName,
      sha256,
      pointCount: count,
      stationId: station?.id ?? null,
      geometry,
    },
    requestId: actor.requestId ?? null,
  }));
  return { id, pointCount, warnings };
}
