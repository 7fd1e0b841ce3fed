import { Router } from 'express';
import type { HealthResponse } from '@rhotrace/api-types';
import type { Sequelize } from 'sequelize';
import { clusterSize, databaseHostsOf, databaseIsUp } from '../db/database';
import { hostLabel } from '../db/database-hosts';

/**
 * `GET /api/health`: 200 with the database up, 503 with it down. No sign-in needed. Says which
 * database host new connections use and, on a Galera node, how many nodes its cluster has.
 */
export function healthRouter(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const up = await databaseIsUp(sequelize);
    const hosts = databaseHostsOf(sequelize);
    const body: HealthResponse = {
      status: up ? 'ok' : 'degraded',
      db: up ? 'up' : 'down',
      dbHost: hosts ? hostLabel(hosts.current) : '',
      clusterSize: up ? await clusterSize(sequelize) : null,
    };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}
