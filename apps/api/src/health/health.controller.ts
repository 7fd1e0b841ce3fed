import type { Request, Response } from 'express';
import type { AppDeps } from '../deps';
import { healthOf } from './health.service';

/** Handlers of the health check. */
export function healthController(deps: Pick<AppDeps, 'sequelize'>) {
  return {
    /** `GET /api/health`: 200 with the database up, 503 with it down. */
    async health(_req: Request, res: Response): Promise<void> {
      const body = await healthOf(deps.sequelize);
      res.status(body.db === 'up' ? 200 : 503).json(body);
    },
  };
}
