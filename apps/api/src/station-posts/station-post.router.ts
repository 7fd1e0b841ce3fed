import { Router, type Request } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { AppDeps } from '../deps';
import { HttpError } from '../errors';
import { readUpload } from '../sweeps/read-upload';
import { authenticateStation, currentStation } from './authenticate-station';
import { SharedRateStore } from './post-rate.service';
import { stationPostController } from './station-post.controller';

const MINUTE_MS = 60_000;

/**
 * `POST /api/station/sweeps`: a station token posts a sweep. Checked in order before the body
 * is read: the token, the token's rate (429 with Retry-After), the Idempotency-Key.
 */
export function stationPostRouter(deps: AppDeps): Router {
  const router = Router();
  const c = stationPostController(deps);
  // per token, counted in the database so the limit holds across API instances and nodes: a
  // first line against a station stuck in a loop. Should the count fail, posts go through (the
  // failure is logged): the limit guards the server and must not refuse a station's data.
  const perToken = rateLimit({
    windowMs: MINUTE_MS,
    store: new SharedRateStore(deps.sequelize, 'station-posts'),
    passOnStoreError: true,
    limit: deps.config.stationPostsPerMinute,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) => `station-token:${currentStation(req).tokenId}`,
    handler: (req, _res, next) => {
      const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const waitMs = (reset?.getTime() ?? Date.now() + MINUTE_MS) - Date.now();
      const seconds = Math.max(1, Math.ceil(waitMs / 1000));
      next(
        new HttpError(
          'too_many_requests',
          `This station token posted more than ${deps.config.stationPostsPerMinute} sweeps ` +
            `in a minute; send again in ${seconds} seconds`,
          { retryAfterS: seconds },
          { 'Retry-After': String(seconds) },
        ),
      );
    },
  });
  router.post(
    '/station/sweeps',
    authenticateStation,
    perToken,
    c.requireKey,
    readUpload(deps.config),
    c.post,
  );
  return router;
}
