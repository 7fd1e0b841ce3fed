/**
 * Reading and soft-deleting sweeps. Visibility follows the wafer: hidden is 404.
 */
import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip as gzipCallback } from 'node:zlib';
import type {
  PointFlag,
  SweepColumn,
  SweepDto,
  SweepGeometry,
  SweepMethod,
  SweepParseReport,
  SweepPointDto,
  SweepSummaryDto,
} from '@rhotrace/api-types';
import { recordAudit } from '../audit/audit.service';
import { forbidden, notFound } from '../errors';
import { rawStorageFor } from '../storage/storage';
import type { StorageKind } from '../storage/raw-storage';
import { User } from '../users/user.model';
import { assignedWaferSql, visibleWafer } from '../wafers/wafer-access.service';
import type { SweepActor } from './sweep-import.service';
import { SweepCache } from './sweep-cache';
import { Sweep, SweepPoint } from './sweep.model';

const gzipAsync = promisify(gzipCallback);

export {
  importSweep,
  previewSweep,
  type ImportSweepInput,
  type SweepActor,
} from './sweep-import.service';

/**
 * The sweep with its uploader's name, when the actor may see it: one query joining the wafer
 * and lot (neither deleted) and, for a technician, their assignment. Hidden or missing is 404.
 */
async function visibleSweep(
  id: number,
  actor: SweepActor,
): Promise<{ sweep: Sweep; uploaderName: string | null }> {
  const assigned = actor.role === 'technician' ? ` AND ${assignedWaferSql('w.id', actor.id)}` : '';
  const rows = (await Sweep.sequelize!.query(
    'SELECT s.*, u.name AS uploader_name FROM sweeps AS s' +
      ' JOIN wafers AS w ON w.id = s.wafer_id AND w.deleted_at IS NULL' +
      ' JOIN lots AS l ON l.id = w.lot_id AND l.deleted_at IS NULL' +
      ' LEFT JOIN users AS u ON u.id = s.uploaded_by_id' +
      ` WHERE s.id = :id AND s.deleted_at IS NULL${assigned}`,
    {
      replacements: { id },
      model: Sweep,
      mapToModel: true,
    },
  )) as Sweep[];
  const sweep = rows[0];
  if (!sweep) throw notFound(`Sweep ${id}`);
  return {
    sweep,
    uploaderName: (sweep.get('uploader_name' as never) as unknown as string | null) ?? null,
  };
}

function summary(sweep: Sweep, uploaderName: string | null): SweepSummaryDto {
  return {
    id: sweep.id,
    waferId: sweep.waferId,
    stationId: sweep.stationId,
    method: sweep.method as SweepMethod,
    geometry: sweep.geometry as SweepGeometry,
    uploadedById: sweep.uploadedById,
    uploadedByName: uploaderName,
    originalName: sweep.originalName,
    sizeBytes: sweep.sizeBytes,
    sha256: sweep.sha256,
    pointCount: sweep.pointCount,
    minTemperatureK: sweep.minTemperatureK,
    maxTemperatureK: sweep.maxTemperatureK,
    createdAt: sweep.createdAt.toISOString(),
  };
}

async function uploaderNames(sweeps: Sweep[]): Promise<Map<number, string>> {
  const ids = [...new Set(sweeps.map((s) => s.uploadedById))];
  const users = ids.length
    ? await User.findAll({ attributes: ['id', 'name'], where: { id: ids } })
    : [];
  return new Map(users.map((u) => [u.id, u.name]));
}

/** The wafer's sweeps, newest first, without points. */
export async function listSweeps(waferId: number, actor: SweepActor): Promise<SweepSummaryDto[]> {
  await visibleWafer(actor, waferId);
  const sweeps = await Sweep.findAll({
    where: { waferId },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  const names = await uploaderNames(sweeps);
  return sweeps.map((s) => summary(s, names.get(s.uploadedById) ?? null));
}

interface StoredRaw {
  rows: number[];
  cells: string[][];
}

/**
 * Points of recently read sweeps, in response form, with their JSON text once a response has
 * needed it (a deletion is soft and checked before the cache is consulted).
 */
interface CachedPoints {
  points: SweepPointDto[];
  json?: string;
  /** The whole answer gzipped, with the head it was made with (a renamed uploader changes it). */
  gzipped?: { head: string; bytes: Buffer };
}
/** Points kept across all cached sweeps (about 0.5 kB each, and as much again as JSON). */
export const POINT_CACHE_LIMIT = 400_000;
const pointCache = new SweepCache<CachedPoints>(POINT_CACHE_LIMIT, (c) => c.points.length);

interface SweepParts {
  head: Omit<SweepDto, 'points'>;
  cached: CachedPoints;
}

/** The sweep's response without points, and its points from the cache or the table. */
async function sweepParts(id: number, actor: SweepActor): Promise<SweepParts> {
  const { sweep, uploaderName } = await visibleSweep(id, actor);
  const columns = sweep.columnMapping as SweepColumn[];
  const head = {
    ...summary(sweep, uploaderName),
    columns,
    metadata: (sweep.metadata ?? {}) as Record<string, string>,
    parseReport: sweep.parseReport as SweepParseReport,
  };
  const cached =
    pointCache.get(sweep) ?? pointCache.remember(sweep, { points: await readPoints(id, columns) });
  return { head, cached };
}

async function readPoints(id: number, columns: SweepColumn[]): Promise<SweepPointDto[]> {
  const points = await SweepPoint.findAll({
    where: { sweepId: id },
    order: [['sequence', 'ASC']],
    raw: true,
  });
  const headers = columns.map((c) => c.header);
  return points.map((p) => {
    const doc = (typeof p.raw === 'string' ? JSON.parse(p.raw) : p.raw) as StoredRaw | string[];
    const stored: StoredRaw = Array.isArray(doc) ? { rows: [p.sourceRow], cells: [doc] } : doc;
    return {
      sequence: p.sequence,
      sourceRow: p.sourceRow,
      temperatureK: p.temperatureK,
      raw: stored.rows.map((row, k) => ({
        row,
        values: Object.fromEntries(headers.map((h, j) => [h, stored.cells[k]?.[j] ?? ''])),
      })),
      currentA: p.currentA,
      voltageV: p.voltageV,
      resistanceOhm: p.resistanceOhm,
      sheetResistanceOhmSq: p.sheetResistanceOhmSq,
      resistivityOhmCm: p.resistivityOhmCm,
      flags: (p.flags ? p.flags.split(',') : []) as PointFlag[],
    };
  });
}

/** The sweep with its columns, metadata, report and every point in sequence. */
export async function getSweep(id: number, actor: SweepActor): Promise<SweepDto> {
  const { head, cached } = await sweepParts(id, actor);
  return { ...head, points: cached.points };
}

/** The sweep read as a response body, see `getSweepBody`. */
export interface SweepBody {
  body: string | Buffer;
  gzipped: boolean;
  /** Changes whenever the body does: sweep id, head and point count (points never change). */
  etag: string;
}

/**
 * `getSweep` as the response body: the JSON text, byte for byte `JSON.stringify(getSweep(…))`,
 * or with `gzip` that text gzipped. The points' JSON is made once per cached sweep and the
 * gzip once per cached sweep and head, not on every read: a 1,000-point sweep is about 300 kB of
 * JSON, and serialising and compressing it was most of a read's CPU.
 */
export async function getSweepBody(
  id: number,
  actor: SweepActor,
  gzip: boolean,
): Promise<SweepBody> {
  const { head, cached } = await sweepParts(id, actor);
  cached.json ??= JSON.stringify(cached.points);
  const headJson = JSON.stringify(head);
  const tag = createHash('sha1').update(headJson).digest('base64url').slice(0, 20);
  const etag = `W/"sweep-${id}-${cached.points.length}-${tag}"`;
  const body = `${headJson.slice(0, -1)},"points":${cached.json}}`;
  if (!gzip) return { body, gzipped: false, etag };
  if (cached.gzipped?.head !== headJson) {
    cached.gzipped = { head: headJson, bytes: await gzipAsync(body, { level: 6 }) };
  }
  return { body: cached.gzipped.bytes, gzipped: true, etag };
}

/** The original upload, byte for byte, with the name it was uploaded under. */
export async function sweepRawFile(
  id: number,
  actor: SweepActor,
): Promise<{ originalName: string; content: Buffer }> {
  const { sweep } = await visibleSweep(id, actor);
  const content = await rawStorageFor(sweep.storageKind as StorageKind).get(sweep.storageKey);
  if (!content) throw notFound(`The raw file of sweep ${id}`);
  return { originalName: sweep.originalName, content };
}

/**
 * Soft-deletes a sweep (kept in the trail): admins and managers any, engineers and physicists
 * their own uploads, technicians none.
 */
export async function deleteSweep(id: number, actor: SweepActor): Promise<void> {
  const { sweep } = await visibleSweep(id, actor);
  const mayDelete =
    actor.role === 'admin' ||
    actor.role === 'manager' ||
    ((actor.role === 'engineer' || actor.role === 'physicist') && sweep.uploadedById === actor.id);
  if (!mayDelete) {
    throw forbidden(
      actor.role === 'technician'
        ? 'Technicians may not delete sweeps'
        : 'You may delete only sweeps you uploaded',
    );
  }
  await Sweep.sequelize!.transaction(async (transaction) => {
    await sweep.update({ deletedById: actor.id }, { transaction });
    await sweep.destroy({ transaction });
    await recordAudit(
      {
        actorId: actor.id,
        action: 'delete',
        entity: 'sweep',
        entityId: id,
        before: {
          waferId: sweep.waferId,
          originalName: sweep.originalName,
          pointCount: sweep.pointCount,
        },
        requestId: actor.requestId ?? null,
      },
      transaction,
    );
  });
  pointCache.forget(id);
}
