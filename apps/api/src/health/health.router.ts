import { Router } from 'express';
import type { HealthResponse } from '@rhotrace/api-types';
import type { Sequelize } from 'sequelize';
import { databaseIsUp } from '../db/database';

/** `GET /api/health`: 200 with the database up, 503 with it down. No sign-in needed. */
export function healthRouter(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const up = await databaseIsUp(sequelize);
    const body: HealthResponse = { status: up ? 'ok' : 'degraded', db: up ? 'up' : 'down' };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}
