import type { AppConfig } from '../config';
import { DatabaseRawStorage } from './database-raw-storage';
import type { RawStorage, StorageKind } from './raw-storage';

/** The raw storage for a configured kind (`RAW_STORAGE`); only `db` exists so far. */
export function rawStorageFor(kind: StorageKind | AppConfig['storage']): RawStorage {
  if (kind === 'db') return new DatabaseRawStorage();
  throw new Error(`Raw storage "${kind}" is not available in this build; use RAW_STORAGE=db`);
}
