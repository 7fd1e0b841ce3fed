/**
 * Parses sweep requests (multipart uploads and ids) and shapes the answers.
 */
import type { SweepColumnOverride } from '@rhotrace/api-types';
import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';
import { mayUploadTo } from '../access/visibility.service';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import { validationFailed } from '../errors';
import { pointsCsv, safeFileName } from './sweep-csv';
import type { ImportChoices } from './import/plan-import';
import { columnsSchema, previewSchema, storeSchema } from './sweep.schemas';
import {
  deleteSweep,
  getSweep,
  getSweepBody,
  importSweep,
  listSweeps,
  previewSweep,
  sweepRawFile,
} from './sweep.service';

function uploaded(req: Request): Express.Multer.File {
  if (!req.file) {
    throw validationFailed('Attach the sweep file in the form field "file"', [
      { field: 'file', problem: 'is required' },
    ]);
  }
  return req.file;
}

/**
 * The user's file name as it is stored and shown: multer's Latin-1 reading undone, folders
 * (`../../x`, `C:\x`) dropped, and control, direction-override and angle-bracket characters
 * replaced. Only ever a label: the bytes are stored under a generated key.
 */
export function storedFileName(multerName: string): string {
  const name = Buffer.from(multerName, 'latin1').toString('utf8');
  const base = name.split(/[\\/]/).pop() ?? '';
  const label = base
    .replace(/[\p{Cc}\u200e\u200f\u202a-\u202e\u2066-\u2069<>]/gu, '_')
    .replace(/^[.\s]+/, '')
    .trim();
  // At most 255 UTF-16 units (the column's width) without splitting a surrogate pair.
  let kept = '';
  for (const ch of label) {
    if (kept.length + ch.length > 255) break;
    kept += ch;
  }
  return kept || 'sweep.csv';
}

/** The `columns` field of an upload: JSON text of `{ index, meaning, unit }` entries. */
export function parseColumns(text: string | undefined): SweepColumnOverride[] | undefined {
  if (text === undefined || text.trim() === '') return undefined;
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw validationFailed('The column mapping is not valid JSON', [
      { field: 'body.columns', problem: 'must be a JSON array of { index, meaning, unit }' },
    ]);
  }
  return parseOrThrow(columnsSchema, json, 'body.columns');
}

/** The store request's choices (method, station, mapping, geometry, map) from its text fields. */
function choicesOf(body: z.infer<typeof previewSchema>): Partial<ImportChoices> {
  const { method, stationId, columns, delimiter, decimalMark, hallFactor, ...rest } = body;
  const { sitePattern, edgeExclusionMm, ...geometry } = rest;
  return {
    ...(method ? { method } : {}),
    ...(hallFactor === undefined ? {} : { hallFactor }),
    layout: {
      ...(delimiter ? { delimiter } : {}),
      ...(decimalMark ? { decimalMark } : {}),
    },
    stationId: stationId ?? null,
    columns: parseColumns(columns),
    geometry: Object.fromEntries(Object.entries(geometry).filter(([, v]) => v !== undefined)),
    map: {
      ...(sitePattern !== undefined && { sitePattern }),
      ...(edgeExclusionMm !== undefined && { edgeExclusionMm }),
    },
  };
}

/** Handlers of sweep uploads and reads. */
export const sweepsController = {
  /**
   * Middleware before an upload's body is read: 403 for a role that may not upload, 404 for a
   * wafer the user may not see, so neither costs an upload.
   */
  async checkUploadTarget(req: Request, _res: Response, next: NextFunction): Promise<void> {
    await mayUploadTo(currentUser(req), parseId(req.params));
    next();
  },
  /** `POST /api/wafers/:id/sweeps/preview` */
  async preview(req: Request, res: Response): Promise<void> {
    const waferId = parseId(req.params);
    const file = uploaded(req);
    const choices = choicesOf(parseOrThrow(previewSchema, req.body ?? {}, 'body'));
    res.json(await previewSweep({ waferId, file: file.buffer, choices }, actorOf(req)));
  },
  /** `POST /api/wafers/:id/sweeps` */
  async store(req: Request, res: Response): Promise<void> {
    const waferId = parseId(req.params);
    const file = uploaded(req);
    const body = parseOrThrow(storeSchema, req.body, 'body');
    const result = await importSweep(
      {
        ...choicesOf(body),
        method: body.method,
        waferId,
        file: file.buffer,
        originalName: storedFileName(file.originalname),
      },
      actorOf(req),
      {
        onRetry: (err) =>
          req.log?.warn({ err }, 'upload retried after a transient database failure'),
      },
    );
    res.status(201).json(result);
  },
  /** `GET /api/wafers/:id/sweeps` */
  async list(req: Request, res: Response): Promise<void> {
    res.json(await listSweeps(parseId(req.params), actorOf(req)));
  },
  /** `GET /api/sweeps/:id` */
  async get(req: Request, res: Response): Promise<void> {
    const gzip = req.acceptsEncodings('gzip') === 'gzip';
    const { body, gzipped, etag } = await getSweepBody(parseId(req.params), actorOf(req), gzip);
    // the compression middleware leaves a body that already has its Content-Encoding alone
    res.vary('Accept-Encoding');
    res.set('ETag', etag);
    if (gzipped) res.set('Content-Encoding', 'gzip');
    res.type('application/json').send(body);
  },
  /** `GET /api/sweeps/:id/points.csv` */
  async pointsCsv(req: Request, res: Response): Promise<void> {
    const id = parseId(req.params);
    const sweep = await getSweep(id, actorOf(req));
    res.type('text/csv; charset=utf-8');
    res.attachment(`sweep-${id}-points.csv`);
    res.send(pointsCsv(sweep.columns, sweep.points));
  },
  /** `GET /api/sweeps/:id/raw` */
  async raw(req: Request, res: Response): Promise<void> {
    const id = parseId(req.params);
    const raw = await sweepRawFile(id, actorOf(req));
    res.type('application/octet-stream');
    res.attachment(safeFileName(raw.originalName, `sweep-${id}.csv`));
    res.send(raw.content);
  },
  /** `DELETE /api/sweeps/:id` */
  async remove(req: Request, res: Response): Promise<void> {
    await deleteSweep(parseId(req.params), actorOf(req));
    res.status(204).end();
  },
};
