import type { StationSweepCreatedResponse } from '@rhotrace/api-types';
import type { Request, Response } from 'express';
import type { AppDeps } from '../deps';
import { validationFailed } from '../errors';
import { requestIdOf } from '../middleware/actor';
import { parseOrThrow } from '../middleware/validate';
import { parseColumns, storedFileName } from '../sweeps/sweep.controller';
import { currentStation } from './authenticate-station';
import { idempotencyHeaders, stationPostFields } from './station-post.schemas';
import { postStationSweep } from './station-post.service';

/** Handlers of the station's own route. */
export function stationPostController(deps: AppDeps) {
  return {
    /** Checked before the body is read, so a post without a key costs no upload. */
    requireKey(req: Request, _res: Response, next: () => void): void {
      parseOrThrow(idempotencyHeaders, { 'Idempotency-Key': req.get('Idempotency-Key') }, 'header');
      next();
    },
    /** `POST /api/station/sweeps` */
    async post(req: Request, res: Response<StationSweepCreatedResponse>): Promise<void> {
      const station = currentStation(req);
      const key = parseOrThrow(
        idempotencyHeaders,
        { 'Idempotency-Key': req.get('Idempotency-Key') },
        'header',
      )['Idempotency-Key'];
      if (!req.file) {
        throw validationFailed('Attach the sweep file in the form field "file"', [
          { field: 'file', problem: 'is required' },
        ]);
      }
      const { waferId, method, columns, ...geometry } = parseOrThrow(
        stationPostFields,
        req.body,
        'body',
      );
      const answer = await postStationSweep(
        station,
        {
          waferId,
          file: req.file.buffer,
          originalName: storedFileName(req.file.originalname),
          method,
          columns: parseColumns(columns),
          geometry: Object.fromEntries(Object.entries(geometry).filter(([, v]) => v !== undefined)),
        },
        key,
        {
          requestId: requestIdOf(req),
          mail: { mailer: deps.mailer, publicUrl: deps.config.publicUrl },
          onRetry: (err) =>
            req.log?.warn({ err }, 'station post retried after a transient database failure'),
        },
      );
      if (answer.replayed) res.set('Idempotent-Replayed', 'true');
      res.status(answer.status).json(answer.body);
    },
  };
}
