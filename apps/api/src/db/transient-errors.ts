/**
 * Transaction failures that say nothing about the request, only about the moment: a deadlock, a
 * Galera certification failure or brute-force abort, a node not yet ready, or a transaction
 * found not to hold what it wrote. A request that is safe to repeat is repeated once; after
 * that the client gets a 503 with Retry-After.
 */
import { ConnectionError } from 'sequelize';
import { HttpError } from '../errors';

/** ER_LOCK_DEADLOCK: InnoDB deadlocks and Galera certification failures and aborts alike. */
const ER_LOCK_DEADLOCK = 1213;
/** ER_UNKNOWN_COM_ERROR: a Galera node answers "WSREP has not yet prepared node" while it joins. */
const ER_UNKNOWN_COM_ERROR = 1047;
/** SQLSTATE of a serialization failure (the standard's "try again"). */
const SERIALIZATION_FAILURE = '40001';

/** Seconds a client is told to wait before it sends the request again. */
export const TRANSIENT_RETRY_AFTER_S = 2;

/**
 * A transaction that did not hold its own writes: a statement changed fewer rows than it must,
 * or the transaction was found closed before its commit. On a Galera node this is what a
 * brute-force abort looks like when its deadlock error went unseen (later statements then run
 * in autocommit or in a new implicit transaction).
 */
export class TransactionLostError extends Error {
  override readonly name = 'TransactionLostError';

  constructor(what: string) {
    super(`the transaction did not hold its writes (${what})`);
  }
}

/** The affected-row count of a driver or Sequelize result, however it is shaped. */
export function affectedRowsOf(result: unknown): number | null {
  if (typeof result === 'number') return result;
  if (typeof result === 'object' && result !== null && 'affectedRows' in result) {
    return Number((result as { affectedRows: unknown }).affectedRows);
  }
  return null;
}

/** Throws `TransactionLostError` unless `result` changed exactly `expected` rows. */
export function requireAffected(result: unknown, expected: number, what: string): void {
  const affected = affectedRowsOf(result);
  if (affected !== expected) {
    throw new TransactionLostError(`${what}: ${affected ?? 'unknown'} of ${expected} row(s)`);
  }
}

/** True for a failure worth one more try of the whole transaction. */
export function isTransientTransactionError(error: unknown): boolean {
  if (error instanceof TransactionLostError) return true;
  const e = error as {
    errno?: number;
    sqlState?: string;
    original?: { errno?: number; sqlState?: string };
  } | null;
  for (const cause of [e, e?.original]) {
    if (!cause) continue;
    if (cause.errno === ER_LOCK_DEADLOCK || cause.errno === ER_UNKNOWN_COM_ERROR) return true;
    if (cause.sqlState === SERIALIZATION_FAILURE) return true;
  }
  return false;
}

/** The 503 for a request whose transaction failed twice for reasons of the moment. */
export function transientUnavailable(what: string): HttpError {
  return new HttpError(
    'unavailable',
    `The database could not complete the ${what} right now (a conflict with concurrent writes ` +
      `or a node that is joining); nothing was stored. Retry in a few seconds`,
    undefined,
    { 'Retry-After': String(TRANSIENT_RETRY_AFTER_S) },
  );
}

/**
 * Runs `attempt` (a whole transaction, safe to repeat) and once more when it fails for reasons
 * of the moment; a second such failure is the 503. `onRetry` hears of each retry.
 */
export async function retryTransientOnce<T>(
  what: string,
  attempt: () => Promise<T>,
  onRetry: (error: unknown) => void = () => undefined,
): Promise<T> {
  try {
    return await attempt();
  } catch (error) {
    if (!isTransientTransactionError(error)) throw error;
    onRetry(error);
  }
  try {
    return await attempt();
  } catch (error) {
    if (isTransientTransactionError(error)) throw transientUnavailable(what);
    throw error;
  }
}

/** MariaDB error numbers meaning "not done, try again": deadlock, lock wait, Galera not ready. */
const TRANSIENT_ERRNOS = new Set([1213, 1205, 1047]);

/** Errors a database connection loss raises, however deep in the driver they start. */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true;
  const e = error as {
    code?: string;
    errno?: number;
    original?: { code?: string; errno?: number };
    parent?: { code?: string; errno?: number };
  };
  if ([e?.errno, e?.original?.errno, e?.parent?.errno].some((n) => TRANSIENT_ERRNOS.has(n ?? 0)))
    return true;
  const codes = [e?.code, e?.original?.code, e?.parent?.code];
  return codes.some(
    (c) =>
      c !== undefined &&
      /^(ECONNREFUSED|ECONNRESET|EPIPE|ETIMEDOUT|ER_SOCKET_UNEXPECTED_CLOSE|ER_CONNECTION_TIMEOUT|ER_GET_CONNECTION_TIMEOUT|ER_CLOSING_POOL|ER_POOL_ALREADY_CLOSED|PROTOCOL_CONNECTION_LOST|ER_CONNECTION_ALREADY_CLOSED|ER_CMD_CONNECTION_CLOSED|ER_SERVER_SHUTDOWN|ER_WSREP_NOT_READY)$/.test(
        c,
      ),
  );
}
