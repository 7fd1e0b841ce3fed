/**
 * Where uploaded files are kept byte for byte. The database implementation writes inside the
 * upload's transaction; an object store (S3) cannot, so its object is written before the
 * transaction commits and the caller deletes it again when the transaction rolls back or the
 * import fails (`writesInTransaction` tells the two apart).
 */
import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';

/** Implementations Rhotrace knows; stored in `sweeps.storage_kind`. */
export type StorageKind = 'db' | 's3';

/** Options every storage call takes: the transaction of the change it belongs to. */
export interface StorageContext {
  transaction?: Transaction;
}

/** Keeps raw upload bytes under keys it generates (never the user's file name). */
export interface RawStorage {
  readonly kind: StorageKind;
  /**
   * True when `put` joins the caller's transaction (rolled back with it); false for an object
   * store, whose object the caller must `delete` when the transaction does not commit.
   */
  readonly writesInTransaction: boolean;
  /** Stores `content` under a new key and returns the key. */
  put(content: Buffer, context?: StorageContext): Promise<string>;
  /** The stored bytes, or null when nothing is stored under `key`. */
  get(key: string, context?: StorageContext): Promise<Buffer | null>;
  /** Removes the bytes (a no-op when the key is unknown). */
  delete(key: string, context?: StorageContext): Promise<void>;
}

/** What every storage key starts with. */
export const STORAGE_KEY_PREFIX = 'raw-';

/** A fresh storage key: `raw-` and a random UUID, safe as a file or object name. */
export function newStorageKey(): string {
  return `${STORAGE_KEY_PREFIX}${randomUUID()}`;
}
