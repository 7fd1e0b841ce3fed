import type { HealthResponse } from '@rhotrace/api-types';
import type { Sequelize } from 'sequelize';
import { clusterSize, databaseHostsOf, databaseIsUp } from '../db/database';
import { hostLabel } from '../db/database-hosts';

/**
 * Whether the database answers, which host new connections use and, on a Galera node, how many
 * nodes its cluster has.
 */
export async function healthOf(sequelize: Sequelize): Promise<HealthResponse> {
  const up = await databaseIsUp(sequelize);
  const hosts = databaseHostsOf(sequelize);
  return {
    status: up ? 'ok' : 'degraded',
    db: up ? 'up' : 'down',
    dbHost: hosts ? hostLabel(hosts.current) : '',
    clusterSize: up ? await clusterSize(sequelize) : null,
  };
}
