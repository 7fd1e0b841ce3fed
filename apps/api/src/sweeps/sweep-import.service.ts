/**
 * Preview and import of probe-station exports. The import runs as named stages, each in
 * `import/`: read the table → detect columns → read a row → pair polarities → turn a row into a
 * point (one entry per measurement method) → flag → store. It reads and converts slice by
 * slice, storing each point once its leg is settled while the rest are converted, then flags the
 * whole sweep (rewriting the flags of the points already stored that the whole-sweep checks
 * flag), and stores the sweep, its raw file, its points and the audit event in one
 * transaction, all together or not at all. A transaction failure of the moment (a deadlock, a
 * Galera certification failure or abort) runs the whole upload once more; a second one is a 503.
 */
import { createHash } from 'node:crypto';
import { MAX_FINDINGS, type SessionUser, type SweepCreatedResponse } from '@rhotrace/api-types';
import { Op, Transaction } from 'sequelize';
import {
  isDatabaseUnavailable,
  retryTransientOnce,
  TransactionLostError,
} from '../db/transient-errors';
import { conflict, HttpError, unprocessable } from '../errors';
import type { RawStorage } from '../storage/raw-storage';
import { mayUploadTo } from '../access/visibility.service';
import { uploadRawStorage } from '../storage/storage';
import { Wafer } from '../wafers/wafer.model';
import { SweepRows } from './import/check-rows';
import { publicColumns } from './import/detect-columns';
import { latePositions, markPoints, type FlagSummary } from './import/flag';
import type { ConvertedPoint } from './import/import-types';
import { planImport, type ImportChoices, type ImportPlan } from './import/plan-import';
import { openTable, unreadableRows } from './import/read-table';
import { POINT_CHUNK } from './import/store/point-writer';
import { RawCopy } from './import/store/raw-copy';
import { rawJson, SweepStore } from './import/store/sweep-store';
import { MAX_PROBLEMS, type OpenedSweepFile } from './parse';
import { Sweep } from './sweep.model';
import { followUpload } from '../assignments/follow-upload';

/** Records read and converted per slice. */
export const IMPORT_SLICE_ROWS = POINT_CHUNK;

/** What `importSweep` needs; the demo seeder calls it directly. */
export interface ImportSweepInput extends ImportChoices {
  waferId: number;
  file: Buffer;
  originalName: string;
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
  const startedAt = new Date();
  let retried = false;
  try {
    return await retryTransientOnce(
      'upload',
      () => importOnce(input, actor, storage, options.hooks ?? {}).catch(lostSweepRow),
      (error) => {
        retried = true;
        options.onRetry?.(error);
      },
    );
  } catch (error) {
    // A caller's hooks (a station post's Idempotency-Key) answer their own repeats.
    const ambiguous = retried || isDatabaseUnavailable(error) || isUnavailableAnswer(error);
    if (options.hooks || !ambiguous) throw error;
    const stored = await committedAnyway(input, actor, startedAt, sha256Of(input.file));
    if (stored) return stored;
    throw error;
  }
}

const sha256Of = (file: Buffer) => createHash('sha256').update(file).digest('hex');

const isUnavailableAnswer = (error: unknown) => error instanceof HttpError && error.status === 503;

/**
 * The sweep this request stored after all, or null. A connection lost during COMMIT (a node
 * killed under it) leaves the outcome unknown: the commit may have been replicated before the
 * answer was lost. A try that failed once may likewise have committed and made the repeat meet
 * its own file (409). Either way a 503 or a 409 would tell the client wrongly that nothing was
 * stored, so the sweep is looked for on a fresh connection: this user's file on this wafer,
 * created since the request began (`created_at` is set by this process's clock).
 */
async function committedAnyway(
  input: ImportSweepInput,
  actor: SweepActor,
  startedAt: Date,
  sha256: string,
): Promise<SweepCreatedResponse | null> {
  const found = await Sweep.findOne({
    where: {
      waferId: input.waferId,
      sha256,
      uploadedById: actor.id,
      createdAt: { [Op.gte]: startedAt },
    },
  }).catch(() => null);
  if (!found) return null;
  const report = found.parseReport as { warnings?: string[] } | null;
  return { id: found.id, pointCount: found.pointCount, warnings: report?.warnings ?? [] };
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

/** One attempt: the file is read again, so a retry starts from the same bytes. */
async function importOnce(
  input: ImportSweepInput,
  actor: SweepActor,
  storage: RawStorage,
  hooks: ImportHooks,
): Promise<SweepCreatedResponse> {
  const file = openTable(input.file, IMPORT_SLICE_ROWS, input.layout);
  if (file.parsed.problems.length) throw unreadableRows(file.parsed.problems);
  const sha256 = sha256Of(input.file);
  const raw = new RawCopy(storage);
  // the sweep the transaction was committing, once its work is done: a failure from here on
  // is in COMMIT, whose outcome a lost connection leaves unknown
  let committing: number | null = null;
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
      const plan = await planImport(file.parsed, input, { wafer, lot }, transaction);
      const rawKey = raw.put(input.file, transaction);
      try {
        const result = await storeSweep(
          { input, actor, file, plan, sha256, storage, rawKey, wafer },
          transaction,
        );
        await followUpload(actor, wafer.id, result.id, transaction);
        await hooks.commit?.(result, transaction);
        committing = result.id;
        return result;
      } catch (error) {
        await raw.settle();
        throw error;
      }
    });
  } catch (error) {
    // the raw copy of a sweep that committed after all must stay
    if (committing === null || !(await mayExist(committing))) await raw.discard();
    throw error;
  }
}

/** False only when the database says the sweep is not there; unknown counts as there. */
const mayExist = (sweepId: number) =>
  Sweep.count({ where: { id: sweepId } }).then(
    (n) => n > 0,
    () => true,
  );

/** What the transaction's work needs once the duplicate check passed and the raw write began. */
interface StoreContext {
  input: ImportSweepInput;
  actor: SweepActor;
  file: OpenedSweepFile;
  plan: ImportPlan;
  sha256: string;
  storage: RawStorage;
  rawKey: Promise<string>;
  wafer: Wafer;
}

/**
 * Runs the stages over the file slice by slice and stores the result. A row problem anywhere
 * stores nothing, since the caller's transaction rolls back.
 */
async function storeSweep(
  ctx: StoreContext,
  transaction: Transaction,
): Promise<SweepCreatedResponse> {
  const { input, actor, file, plan, sha256, storage, rawKey, wafer } = ctx;
  const { station, geometry } = plan;
  const parsed = file.parsed;
  const originalName = input.originalName.slice(0, 255) || 'sweep.csv';
  const rows = new SweepRows(file, plan, input.method, IMPORT_SLICE_ROWS);
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
      columnMapping: publicColumns(plan.columns),
      metadata: parsed.layout.metadata,
      mapInfo: rows.mapInfo,
    },
    rawJson(parsed),
    transaction,
  );
  const points: ConvertedPoint[] = [];
  let flags: FlagSummary;
  try {
    // Points are written as their legs settle, while the rest are converted; flags found over
    // the whole sweep are then rewritten on the few already written that carry one.
    let sent = 0;
    for (const slice of rows.points()) {
      for (const p of slice) points.push(p);
      const settled = rows.settleLegs(points, sent);
      if (settled > sent && !rows.problems.length) await store.write(points.slice(sent, settled));
      sent = settled;
    }
    if (rows.problems.length) {
      throw unprocessable(
        'Some rows hold values that cannot be stored; nothing was stored',
        rows.problems.slice(0, MAX_PROBLEMS),
      );
    }
    flags = rows.finish();
    markPoints(points, flags);
    await store.write(points.slice(sent));
    await store.rewriteFlags(points, latePositions(flags, sent));
  } catch (error) {
    await store.abandon();
    throw error;
  }
  const disagreements = plan.metadata.filter((f) => f.agreement === 'disagrees');
  const warnings = [...plan.warnings, ...disagreements.map((f) => f.sentence), ...flags.warnings];
  const report = {
    delimiter: parsed.layout.delimiter,
    decimalMark: parsed.layout.decimalMark,
    headerRow: parsed.layout.headerLine,
    rowCount: parsed.table.records.length,
    warnings,
    flaggedPoints: flags.flagged,
    findings: flags.findings.slice(0, MAX_FINDINGS),
    temperature: plan.temperature.conversion,
    ...(rows.hallReport ? { hall: rows.hallReport } : {}),
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
