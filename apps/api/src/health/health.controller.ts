import type { HealthResponse } from '@rhotrace/api-types';
import type { Request, Response } from 'express';
import type { AppDeps } from '../deps';
import { databaseIsUp } from '../db/database';

/** Handlers of the health check. */
export function healthController(deps: Pick<AppDeps, 'sequelize'>) {
  return {
    /** `GET /api/health`: 200 with the database up, 503 with it down. */
    async health(_req: Request, res: Response): Promise<void> {
      const up = await databaseIsUp(deps.sequelize);
      const body: HealthResponse = { status: up ? 'ok' : 'degraded', db: up ? 'up' : 'down' };
      res.status(up ? 200 : 503).json(body);
    },
  };
}
