import { RawFile } from '../sweeps/sweep.model';
import { newStorageKey, type RawStorage, type StorageContext } from './raw-storage';

/** Raw files in the `raw_files` table, written in the caller's transaction. */
export class DatabaseRawStorage implements RawStorage {
  readonly kind = 'db' as const;
  readonly writesInTransaction = true;

  async put(content: Buffer, context: StorageContext = {}): Promise<string> {
    const storageKey = newStorageKey();
    await RawFile.create(
      { storageKey, sizeBytes: content.length, content },
      { transaction: context.transaction },
    );
    return storageKey;
  }

  async get(key: string, context: StorageContext = {}): Promise<Buffer | null> {
    const row = await RawFile.findByPk(key, { transaction: context.transaction });
    return row ? Buffer.from(row.content) : null;
  }

  async delete(key: string, context: StorageContext = {}): Promise<void> {
    await RawFile.destroy({ where: { storageKey: key }, transaction: context.transaction });
  }
}
