/**
 * Chooses the raw storage: the configured one for new uploads (`RAW_STORAGE`), and for reading
 * the one a sweep names in `storage_kind`.
 */
import type { AppConfig } from '../config';
import { DatabaseRawStorage } from './database-raw-storage';
import type { RawStorage, StorageKind } from './raw-storage';
import { S3RawStorage, s3SettingsFromEnv } from './s3-raw-storage';

const database = new DatabaseRawStorage();
/** One S3 client per distinct setting, reused by every request. */
const s3Clients = new Map<string, S3RawStorage>();
let configured: Pick<AppConfig, 'storage'> = { storage: 'db' };

/**
 * The raw storage of a kind, or of a configuration's `storage` (`RAW_STORAGE`). S3 settings come
 * from the `S3_*` variables of `env` (default `process.env`); a missing one throws, naming it.
 */
export function rawStorageFor(
  kindOrConfig: StorageKind | Pick<AppConfig, 'storage'>,
  env: Record<string, string | undefined> = process.env,
): RawStorage {
  const kind = typeof kindOrConfig === 'string' ? kindOrConfig : kindOrConfig.storage;
  if (kind === 'db') return database;
  if (kind === 's3') {
    const settings = s3SettingsFromEnv(env);
    const id = JSON.stringify(settings);
    let storage = s3Clients.get(id);
    if (!storage) {
      storage = new S3RawStorage(settings);
      s3Clients.set(id, storage);
    }
    return storage;
  }
  throw new Error(`Raw storage "${String(kind)}" is unknown; use RAW_STORAGE=db or RAW_STORAGE=s3`);
}

/**
 * Sets the storage new uploads go to for this process (the app calls it with its
 * configuration). Checks the S3 settings at once, so a misconfigured server fails at start.
 */
export function configureRawStorage(config: Pick<AppConfig, 'storage'>): void {
  rawStorageFor(config);
  configured = { storage: config.storage };
}

/** The storage new uploads go to (`db` until `configureRawStorage` says otherwise). */
export function uploadRawStorage(): RawStorage {
  return rawStorageFor(configured);
}

/** Closes the S3 clients (tests and shutdown); they are created again on next use. */
export function closeRawStorages(): void {
  for (const storage of s3Clients.values()) storage.close();
  s3Clients.clear();
}
