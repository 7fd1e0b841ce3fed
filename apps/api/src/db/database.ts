import mariadb from 'mariadb';
import { Sequelize } from 'sequelize';
import { DatabaseHosts, hostLabel, type DatabaseHost } from './database-hosts';
import type { DbConfig } from '../config';
import { initAssignmentModel } from '../assignments/assignment.model';
import { initAssignmentPlanModel } from '../assignments/assignment-plan.model';
import { initAuditEventModel } from '../audit/audit-event.model';
import { initFitModel } from '../fits/fit.model';
import { initImportSettingsModel } from '../import-settings/import-settings.model';
import { initLotModel } from '../lots/lot.model';
import { initOutgoingEmailModel } from '../mail/outgoing-email.model';
import { initStationTokenModel } from '../station-tokens/station-token.model';
import { initStationModel } from '../stations/station.model';
import { initSweepModels } from '../sweeps/sweep.model';
import { initUserModels } from '../users/user.model';
import { initWaferModel } from '../wafers/wafer.model';

/**
 * Opens a Sequelize connection pool to MariaDB and registers every model. The schema itself is
 * only ever changed by the migrations in db/migrations; `sync()` is never called.
 */
export function connectDatabase(db: DbConfig, options: { poolMax?: number } = {}): Sequelize {
  const hosts = new DatabaseHosts(db.hosts ?? [{ host: db.host, port: db.port }], {
    probe: (host, timeoutMs) => nodeIsReady(db, host, timeoutMs),
    trustMs: 1_000,
    waitMs: 8_000,
  });
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
  watchHosts(sequelize, hosts);
  retryTransientOutsideTransactions(sequelize);
  initUserModels(sequelize);
  initLotModel(sequelize);
  initWaferModel(sequelize);
  initStationModel(sequelize);
  initStationTokenModel(sequelize);
  initAssignmentModel(sequelize);
  initAssignmentPlanModel(sequelize);
  initSweepModels(sequelize);
  initFitModel(sequelize);
  initImportSettingsModel(sequelize);
  initAuditEventModel(sequelize);
  initOutgoingEmailModel(sequelize);
  return sequelize;
}

/** A connection's server is a Galera node that cannot take queries yet (joining, donor lost). */
export class NodeNotReadyError extends Error {
  readonly code = 'ER_WSREP_NOT_READY';
  constructor(host: DatabaseHost) {
    super(`database node ${hostLabel(host)} is not ready (wsrep_ready is OFF)`);
  }
}

/**
 * Whether `host` takes queries now: it accepts a sign-in and, when it is a Galera node, reports
 * `wsrep_ready` ON (a node that is joining or has lost the primary component answers TCP but
 * refuses statements with error 1047).
 */
async function nodeIsReady(db: DbConfig, host: DatabaseHost, timeoutMs: number): Promise<boolean> {
  let connection: mariadb.Connection | null = null;
  try {
    connection = await mariadb.createConnection({
      host: host.host,
      port: host.port,
      user: db.user,
      password: db.password,
      connectTimeout: timeoutMs,
    });
    const [row] = (await connection.query(READINESS_SQL)) as Array<Record<string, unknown>>;
    return String(row?.wsrepOn).toUpperCase() !== 'ON' || String(row?.ready).toUpperCase() === 'ON';
  } catch {
    return false;
  } finally {
    await connection?.end().catch(() => undefined);
  }
}

// both are null on a server built without Galera
const READINESS_SQL =
  "SELECT (SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_VARIABLES WHERE VARIABLE_NAME = 'WSREP_ON') AS wsrepOn, " +
  "(SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'WSREP_READY') AS ready";

interface DriverConnection {
  query(sql: string): Promise<Array<Record<string, unknown>>>;
  end(): Promise<void>;
}

const hostsOf = new WeakMap<Sequelize, DatabaseHosts>();

/** The hosts a pool connects to, and which one its newest connection uses. */
export function databaseHostsOf(sequelize: Sequelize): DatabaseHosts | undefined {
  return hostsOf.get(sequelize);
}

/**
 * Points each new connection at the first host that answers, and on a Galera node checks that it
 * is ready and makes its reads causal (`wsrep_sync_wait = 1`): a read on one node then sees every
 * write committed on any node before it, so a sweep stored through one API instance is readable
 * at once through another.
 */
function watchHosts(sequelize: Sequelize, hosts: DatabaseHosts): void {
  hostsOf.set(sequelize, hosts);
  // Sequelize hands every new connection the same config object: set on it just before connecting
  sequelize.addHook('beforeConnect', async (config) => {
    const chosen = await hosts.pick();
    config.host = chosen.host;
    config.port = String(chosen.port);
  });
  sequelize.addHook('afterConnect', async (raw, config) => {
    const connection = raw as DriverConnection;
    const { host: name, port } = config as { host?: string; port?: string | number };
    const host: DatabaseHost = { host: name ?? '', port: Number(port) };
    const [row] = await connection.query(READINESS_SQL);
    if (String(row?.wsrepOn).toUpperCase() === 'ON') {
      if (String(row?.ready).toUpperCase() !== 'ON') {
        hosts.markDown(host);
        await connection.end().catch(() => undefined);
        throw new NodeNotReadyError(host);
      }
      await connection.query('SET SESSION wsrep_sync_wait = 1');
    }
    hosts.markUp(host);
  });
}

/**
 * Errors a Galera cluster gives that a single server does not, all meaning the statement did not
 * take effect: a deadlock or certification failure between nodes (1213), a node not yet ready
 * after rejoining (1047).
 */
export const TRANSIENT_CLUSTER_ERRORS = [/Deadlock found/i, /WSREP has not yet prepared node/i];

/**
 * A statement outside a transaction that fails with a transient cluster error is sent once more
 * (it did not take effect, so repeating it is safe). Statements inside a transaction never are:
 * the failure rolled the whole transaction back, and a repeat would run outside it.
 */
function retryTransientOutsideTransactions(sequelize: Sequelize): void {
  const query = sequelize.query.bind(sequelize) as (sql: unknown, options?: unknown) => unknown;
  const retry = { max: 2, match: TRANSIENT_CLUSTER_ERRORS, backoffBase: 50 };
  Object.assign(sequelize, {
    query: (sql: unknown, options?: { transaction?: unknown; retry?: unknown }) =>
      query(sql, options?.transaction ? options : { ...options, retry: options?.retry ?? retry }),
  });
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

/** `wsrep_cluster_size` of the server a pooled connection reaches; null when it is no Galera node. */
export async function clusterSize(sequelize: Sequelize): Promise<number | null> {
  try {
    const [rows] = await sequelize.query(
      "SELECT VARIABLE_VALUE AS size FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'WSREP_CLUSTER_SIZE'",
    );
    const size = Number((rows as Array<{ size?: unknown }>)[0]?.size);
    return Number.isInteger(size) && size > 0 ? size : null;
  } catch {
    return null;
  }
}
