/**
 * Reading and soft-deleting sweeps. Visibility follows the wafer: hidden is 404.
 */
import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip as gzipCallback } from 'node:zlib';
import type {
  PointFlag,
  StationUploadDto,
  PointQuantities,
  SweepColumn,
  SweepDto,
  SweepGeometry,
  SweepMapInfo,
  SweepMethod,
  SweepParseReport,
  SweepPointDto,
  SweepSummaryDto,
} from '@rhotrace/api-types';
import { assertMayDeleteSweep } from '../access/policy';
import { visibleSweepWithUploader, visibleWafer } from '../access/visibility.service';
import { auditChange } from '../audit/audit.service';
import { notFound } from '../errors';
import { rawStorageFor } from '../storage/storage';
import type { StorageKind } from '../storage/raw-storage';
import { User } from '../users/user.model';
import type { SweepActor } from './sweep-import.service';
import { stationUploadsOf } from '../station-tokens/station-tokens.service';
import { SweepCache } from './sweep-cache';
import { Sweep, SweepPoint } from './sweep.model';

const gzipAsync = promisify(gzipCallback);

export { importSweep, type ImportSweepInput, type SweepActor } from './sweep-import.service';
export { previewSweep } from './sweep-preview.service';
import { inTransaction } from '../db/connection';

function summary(
  sweep: Sweep,
  uploaderName: string | null,
  via: Map<number, StationUploadDto>,
): SweepSummaryDto {
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
    map: (sweep.mapInfo as SweepMapInfo | null) ?? null,
    uploadedVia: sweep.stationTokenId ? (via.get(sweep.stationTokenId) ?? null) : null,
    flaggedPoints: flaggedPointsOf(sweep.parseReport),
  };
}

/** The report's count of doubtful points (0 when the report predates it or is unreadable). */
function flaggedPointsOf(report: unknown): number {
  const doc = (typeof report === 'string' ? safeJson(report) : report) as {
    flaggedPoints?: unknown;
  } | null;
  return typeof doc?.flaggedPoints === 'number' ? doc.flaggedPoints : 0;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
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
  const via = await stationUploadsOf(sweeps.map((s) => s.stationTokenId));
  return sweeps.map((s) => summary(s, names.get(s.uploadedById) ?? null, via));
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
  const { sweep, uploaderName } = await visibleSweepWithUploader(actor, id);
  const columns = sweep.columnMapping as SweepColumn[];
  const head = {
    ...summary(sweep, uploaderName, await stationUploadsOf([sweep.stationTokenId])),
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
      site:
        p.siteXMm === null || p.siteYMm === null
          ? null
          : { xMm: Number(p.siteXMm), yMm: Number(p.siteYMm), label: p.siteLabel },
      // Only sweeps that have quantities carry the key: most points stay as small as before.
      ...(p.quantities ? { quantities: quantitiesOf(p.quantities) } : {}),
      leg: p.leg ?? null,
    };
  });
}

/** A stored quantities document (text from a raw read). */
function quantitiesOf(stored: unknown): PointQuantities {
  return (typeof stored === 'string' ? JSON.parse(stored) : stored) as PointQuantities;
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
  const { sweep } = await visibleSweepWithUploader(actor, id);
  const content = await rawStorageFor(sweep.storageKind as StorageKind).get(sweep.storageKey);
  if (!content) throw notFound(`The raw file of sweep ${id}`);
  return { originalName: sweep.originalName, content };
}

/** Soft-deletes a sweep (kept in the trail) when `mayDeleteSweep` allows it. */
export async function deleteSweep(id: number, actor: SweepActor): Promise<void> {
  const { sweep } = await visibleSweepWithUploader(actor, id);
  assertMayDeleteSweep(actor, sweep);
  await inTransaction(async (transaction) => {
    await sweep.update({ deletedById: actor.id }, { transaction });
    await sweep.destroy({ transaction });
    await auditChange(transaction, actor, 'delete', 'sweep', id, {
      before: {
        waferId: sweep.waferId,
        originalName: sweep.originalName,
        pointCount: sweep.pointCount,
      },
    });
  });
  pointCache.forget(id);
}
