import type { Sequelize, Transaction } from 'sequelize';
import { AuditEvent } from '../audit/audit-event.model';

/**
 * The database the models use: the connection `connectDatabase` bound them to (every model is
 * bound to the same one). Services reach the database only through here or a model.
 */
export function database(): Sequelize {
  const sequelize = AuditEvent.sequelize;
  if (!sequelize) throw new Error('connectDatabase has not run');
  return sequelize;
}

/** Runs `work` in one transaction of `database()`: committed when it resolves, else rolled back. */
export function inTransaction<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
  return database().transaction(work);
}
