import { Sequelize } from 'sequelize';
import type { DbConfig } from '../config';
import { initAssignmentModel } from '../assignments/assignment.model';
import { initAuditEventModel } from '../audit/audit-event.model';
import { initFitModel } from '../fits/fit.model';
import { initLotModel } from '../lots/lot.model';
import { initOutgoingEmailModel } from '../mail/outgoing-email.model';
import { initStationModel } from '../stations/station.model';
import { initSweepModels } from '../sweeps/sweep.model';
import { initUserModels } from '../users/user.model';
import { initWaferModel } from '../wafers/wafer.model';

/**
 * Opens a Sequelize connection pool to MariaDB and registers every model. The schema itself is
 * only ever changed by the migrations in db/migrations; `sync()` is never called.
 */
export function connectDatabase(db: DbConfig, options: { poolMax?: number } = {}): Sequelize {
  const sequelize = new Sequelize(db.name, db.user, db.password, {
    host: db.host,
    port: db.port,
    dialect: 'mariadb',
    logging: false,
    pool: { max: options.poolMax ?? 40, min: 0, acquire: 10_000, idle: 10_000 },
    dialectOptions: {
      connectTimeout: 5_000,
      // Keep BIGINT and DECIMAL as numbers for JSON; ids never come near 2^53.
      bigIntAsNumber: true,
      decimalAsNumber: true,
      insertIdAsNumber: true,
      timezone: 'Z',
    },
    timezone: '+00:00',
  });
  initUserModels(sequelize);
  initLotModel(sequelize);
  initWaferModel(sequelize);
  initStationModel(sequelize);
  initAssignmentModel(sequelize);
  initSweepModels(sequelize);
  initFitModel(sequelize);
  initAuditEventModel(sequelize);
  initOutgoingEmailModel(sequelize);
  return sequelize;
}

/** True when the database answers a trivial query within the timeout. */
export async function databaseIsUp(sequelize: Sequelize, timeoutMs = 1_500): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      sequelize.query('SELECT 1'),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), timeoutMs);
      }),
    ]);
    return true;
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}
